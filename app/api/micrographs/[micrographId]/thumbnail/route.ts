import { derivedImageRoute } from "@/lib/server/derived-image-route";

export const GET = derivedImageRoute("thumbnail");
