// Shown inside the shell while a page of this area loads its data (a Suspense boundary per route).
import { PageSkeleton } from "@/components/ui/page-skeleton";

export default function Loading() {
  return <PageSkeleton />;
}
