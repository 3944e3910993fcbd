// How much of a length-limited text is used, announced politely to screen readers as it changes
// and shown in the refusal colour past the limit (the schema then refuses the text; nothing is cut).
export function CharacterCount({ id, length, max }: { id: string; length: number; max: number }) {
  const over = length > max;
  return (
    <p
      id={id}
      aria-live="polite"
      className={
        over ? "text-sm font-semibold text-clay tabular-nums" : "text-sm text-muted tabular-nums"
      }
    >
      {over
        ? `${(length - max).toLocaleString("en-US")} ${length - max === 1 ? "character" : "characters"} over the ${max.toLocaleString("en-US")}-character limit`
        : `${length.toLocaleString("en-US")} of ${max.toLocaleString("en-US")} characters`}
    </p>
  );
}
