// Sward's own mark: three blades of grass on a rounded tile.
export function SwardMark({ size = 32 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="8" fill="#2f6b3a" />
      <path d="M9 25c0-6 1-10 4-14-1 5-1 9 0 14z" fill="#e3efe0" />
      <path d="M15 25c0-8 1.5-13 5-17-2 6-2.5 11-1.5 17z" fill="#ffffff" />
      <path d="M21 25c0-4 1-7 3.5-9-1 3-1.2 6-.8 9z" fill="#e3efe0" />
    </svg>
  );
}
