"use client";

export { RouteError as default } from "@/components/ui/route-error";
