import { derivedImageRoute } from "@/server/http/derived-image-route";

export const GET = derivedImageRoute("thumbnail");
