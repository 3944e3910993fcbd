"use client";

// A form whose fields stay disabled until React has hydrated it. Before then, a value typed on a
// slow phone is overwritten when the form library takes the field over (a latitude typed as "95"
// became "40.30595" and was saved), and a submit is the browser's own GET that puts the fields in
// the address bar. Disabled for that moment, nothing typed is lost and nothing is sent unchecked.
import { useSyncExternalStore, type ComponentProps } from "react";

const noSubscription = () => () => {};

/** False in the server's HTML and during hydration, true once the page runs in the browser. */
function useHydrated(): boolean {
  return useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
}

export function HydratedForm(props: ComponentProps<"form">) {
  const hydrated = useHydrated();
  return (
    <fieldset disabled={!hydrated} className="contents">
      <form {...props} />
    </fieldset>
  );
}
