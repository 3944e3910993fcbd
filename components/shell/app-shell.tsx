// The signed-in frame: side navigation on a desktop, a bottom bar within thumb reach on a phone.
import type { LucideIcon } from "lucide-react";
import type { ReactNode } from "react";

import { SignOutButton } from "@/components/auth/sign-out-button";
import { DeviceOwner } from "@/components/pwa/device-owner";
import { SwardMark } from "@/components/ui/sward-mark";
import type { Actor } from "@/lib/auth/actor";

import { MoreMenu } from "./more-menu";
import { NavLink } from "./nav-link";

/** The phone bar holds this many entries; with more, the last place is "More" with the rest. */
const BAR_ENTRIES = 5;

export interface NavItem {
  href: string;
  label: string;
  icon: LucideIcon;
  /** Other path prefixes under which this entry is the current one (e.g. a property of the book). */
  also?: string[];
}

const ROLE_LABEL = {
  manager: "Manager",
  technician: "Technician",
  homeowner: "Homeowner",
} as const;

export function AppShell({
  actor,
  nav,
  children,
}: {
  actor: Actor;
  nav: NavItem[];
  children: ReactNode;
}) {
  const onBar = nav.length > BAR_ENTRIES ? nav.slice(0, BAR_ENTRIES - 1) : nav;
  const inMore = nav.slice(onBar.length);
  return (
    <div className="min-h-dvh md:flex">
      <DeviceOwner userId={actor.userId} />
      <aside className="no-print hidden w-64 shrink-0 flex-col border-r border-line bg-card p-4 md:flex">
        <div className="mb-6 flex items-center gap-2">
          <SwardMark />
          <span className="text-xl font-bold">Sward</span>
        </div>
        <nav aria-label="Main" className="flex flex-col gap-1">
          {nav.map(({ href, label, icon: Icon, also }) => (
            <NavLink key={href} href={href} also={also} variant="side">
              <Icon className="size-5" aria-hidden="true" />
              {label}
            </NavLink>
          ))}
        </nav>
        <div className="mt-auto border-t border-line pt-4">
          <p className="font-semibold">{actor.name}</p>
          <p className="mb-2 text-sm text-muted">
            {ROLE_LABEL[actor.role]} · {actor.companyName}
          </p>
          <SignOutButton />
        </div>
      </aside>

      <div className="flex min-w-0 flex-1 flex-col">
        <header className="no-print flex items-center justify-between gap-2 border-b border-line bg-card px-4 py-2 md:hidden">
          <div className="flex items-center gap-2">
            <SwardMark size={28} />
            <div className="leading-tight">
              <p className="font-bold">Sward</p>
              <p className="text-sm text-muted">{actor.companyName}</p>
            </div>
          </div>
          <SignOutButton compact />
        </header>
        <main
          id="main"
          className="mx-auto w-full max-w-reading flex-1 px-4 pt-6 pb-28 md:px-8 md:pb-10"
        >
          {children}
        </main>
        <nav
          aria-label="Main"
          className="no-print fixed inset-x-0 bottom-0 flex gap-0.5 border-t border-line bg-card px-1 pt-2 pb-[max(0.5rem,env(safe-area-inset-bottom))] md:hidden"
        >
          {onBar.map(({ href, label, icon: Icon, also }) => (
            <NavLink key={href} href={href} also={also} variant="bar">
              <Icon className="size-6" aria-hidden="true" />
              {label}
            </NavLink>
          ))}
          {inMore.length ? (
            <MoreMenu paths={inMore.flatMap((item) => [item.href, ...(item.also ?? [])])}>
              {inMore.map(({ href, label, icon: Icon, also }) => (
                <NavLink key={href} href={href} also={also} variant="side">
                  <Icon className="size-5" aria-hidden="true" />
                  {label}
                </NavLink>
              ))}
            </MoreMenu>
          ) : null}
        </nav>
      </div>
    </div>
  );
}
