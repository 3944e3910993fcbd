// At most N photo decodes at once per server process: a 24 MP photo needs ~75 MB while it is
// decoded, so a burst of uploads queues instead of exhausting memory.
export function createLimiter(max: number) {
  let active = 0;
  const waiting: (() => void)[] = [];
  return async function limit<T>(task: () => Promise<T>): Promise<T> {
    if (active >= max) await new Promise<void>((resolve) => waiting.push(resolve));
    active++;
    try {
      return await task();
    } finally {
      active--;
      waiting.shift()?.();
    }
  };
}

export const limitPhotoWork = createLimiter(2);
