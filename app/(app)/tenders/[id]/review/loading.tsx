import { PageSkeleton } from "@/app/_components/page-skeleton";

export default function Loading() {
  return <PageSkeleton what="the technical review" rows={5} panels={2} />;
}
