// Types of lib/http/edge-address.mjs (plain JavaScript: node loads it with --import before Next).
export function trustedProxyCount(value?: string): number;
export function clientAddressOf(
  forwardedFor: string | string[] | undefined,
  peer: string | undefined,
  proxies: number,
): string;
export function settleForwardedHeaders(
  req: {
    headers: Record<string, string | string[] | undefined>;
    socket?: { remoteAddress?: string };
  },
  proxies: number,
): void;
