import { NotFoundMessage } from "@/components/shell/not-found-message";

export default function NotFound() {
  return (
    <main className="px-4">
      <NotFoundMessage />
    </main>
  );
}
