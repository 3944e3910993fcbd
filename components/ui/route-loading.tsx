// The loading.tsx of list pages (each re-exports this): shown inside the shell while the page
// reads its data (the route's Suspense boundary).
// Only leaf pages that never redirect or answer "not found" themselves have one: once a loading
// boundary has streamed, the response's status is already 200, so a redirect or a 404 thrown by a
// page below it would reach the browser as a 200. Pages that can answer so check first and stream
// their body through their own Suspense (PageSkeleton) after the check. The area's layout still
// checks the role before anything is sent.
import { PageSkeleton } from "@/components/ui/page-skeleton";

export default function RouteLoading() {
  return <PageSkeleton />;
}
