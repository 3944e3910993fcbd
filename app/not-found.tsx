import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-md px-4 py-16">
      <h1 className="text-3xl font-bold">Not found</h1>
      <p className="mt-2 text-muted">This page does not exist, or it is not part of what your account can see.</p>
      <Link href="/" className={buttonClass("primary", "mt-6 no-underline")}>
        Go to my start page
      </Link>
    </main>
  );
}
