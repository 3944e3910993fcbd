"use client";

// Prints the report (the page's print styles drop the navigation and buttons).
import { Printer } from "lucide-react";

import { Button } from "@/components/ui/button";

export function PrintButton() {
  return (
    <Button type="button" variant="secondary" className="no-print" onClick={() => window.print()}>
      <Printer className="size-5" aria-hidden="true" />
      Print this report
    </Button>
  );
}
