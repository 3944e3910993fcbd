"use client";

// A navigation link that marks the current page for sighted and screen-reader users.
import clsx from "clsx";
import Link from "next/link";
import { usePathname } from "next/navigation";
import type { ReactNode } from "react";

export function NavLink({
  href,
  also = [],
  children,
  variant,
}: {
  href: string;
  also?: string[];
  children: ReactNode;
  variant: "side" | "bar";
}) {
  const pathname = usePathname();
  const isCurrent = [href, ...also].some((p) => pathname === p || pathname.startsWith(`${p}/`));
  return (
    <Link
      href={href}
      aria-current={isCurrent ? "page" : undefined}
      className={clsx(
        "flex min-h-tap items-center gap-2 rounded-lg font-semibold no-underline",
        variant === "side"
          ? "px-3 py-2"
          : "min-w-0 flex-1 basis-0 flex-col justify-center gap-0.5 px-0.5 py-1 text-center text-xs leading-tight",
        isCurrent ? "bg-sward-tint text-sward-deep" : "text-ink hover:bg-sward-tint",
      )}
    >
      {children}
    </Link>
  );
}
