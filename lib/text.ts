// Text made safe for where it goes: HTML of e-mails, and LIKE patterns of searches.

/** Escapes text for HTML (element content and quoted attributes). */
export const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!,
  );

/** Escapes LIKE wildcards, so what a person types is searched as text. */
export const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);
