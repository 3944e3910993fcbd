// The frame and the one button every Sward e-mail shares (pure HTML strings, inline styles: mail
// clients ignore style sheets). Callers escape their own text; the button escapes its own.
import { escapeHtml } from "@/lib/text";

export function emailFrame(parts: string[]): string {
  return `<div style="font-family:system-ui,sans-serif;color:#18211b;max-width:36rem">\n${parts.filter(Boolean).join("\n")}\n</div>`;
}

export function emailButton(href: string, label: string): string {
  return `<p><a href="${escapeHtml(href)}" style="display:inline-block;background:#2f6b3a;color:#fff;padding:12px 18px;border-radius:8px;text-decoration:none;font-weight:bold">${escapeHtml(label)}</a></p>`;
}
