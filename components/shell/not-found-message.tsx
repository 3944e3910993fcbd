// The words of a 404, shared by the root page and the signed-in shells.
import Link from "next/link";

import { buttonClass } from "@/components/ui/button";

export function NotFoundMessage() {
  return (
    <div className="mx-auto max-w-md py-10">
      <h1 className="text-3xl font-bold">Not found</h1>
      <p className="mt-2 text-muted">
        This page does not exist, or it is not part of what your account can see.
      </p>
      <Link href="/" className={buttonClass("primary", "mt-6 no-underline")}>
        Go to my start page
      </Link>
    </div>
  );
}
