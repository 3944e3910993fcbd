// Button styles shared by every screen: large tap targets, high contrast.
import clsx from "clsx";
import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "quiet";

const VARIANTS: Record<Variant, string> = {
  primary: "bg-sward text-white hover:bg-sward-deep disabled:bg-muted",
  secondary: "border border-line bg-card text-ink hover:bg-sward-tint",
  quiet: "text-ink hover:bg-sward-tint",
};

export function buttonClass(variant: Variant = "primary", className?: string): string {
  return clsx(
    "inline-flex min-h-tap items-center justify-center gap-2 rounded-lg px-4 py-2 text-base font-semibold transition-colors disabled:cursor-not-allowed",
    VARIANTS[variant],
    className,
  );
}

export function Button({
  variant = "primary",
  className,
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button className={buttonClass(variant, className)} {...props} />;
}
