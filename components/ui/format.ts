// Number formatting with units (tabular figures come from the global CSS).
const integer = new Intl.NumberFormat("en-US", { maximumFractionDigits: 0 });

export function formatAreaFt2(value: number): string {
  return `${integer.format(value)} ft²`;
}

export function formatCount(value: number, one: string, many: string): string {
  return `${integer.format(value)} ${value === 1 ? one : many}`;
}
