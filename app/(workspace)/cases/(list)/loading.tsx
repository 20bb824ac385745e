import { PageSkeleton } from "@/components/ui/page-skeleton";

export default PageSkeleton;
