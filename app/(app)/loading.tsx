import { SkeletonRows } from "@/components/ui/skeleton";

export default function Loading() {
  return <SkeletonRows rows={6} label="Loading the page" />;
}
