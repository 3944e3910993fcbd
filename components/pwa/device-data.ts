// What the field app keeps on the phone, and forgetting it (client only). A phone may be shared:
// at sign-out, and when another person signs in on it, every cached field response, every
// IndexedDB database of the app (the outbox among them) and the app's local storage are deleted.
import { FIELD_CACHES, SW_MESSAGES } from "@/lib/pwa/field-routes";

const OWNER_KEY = "sward:device-owner";
/** How long one database deletion may wait on a connection another tab holds open. */
const DELETE_WAIT_MS = 3000;

function deleteDatabase(name: string): Promise<void> {
  return new Promise((resolve) => {
    const timer = setTimeout(resolve, DELETE_WAIT_MS);
    const req = indexedDB.deleteDatabase(name);
    const done = () => {
      clearTimeout(timer);
      resolve();
    };
    req.onsuccess = done;
    req.onerror = done;
  });
}

/** Asks the service worker to delete its field caches too, and waits (briefly) for its answer. */
function tellWorker(): Promise<void> {
  const worker = navigator.serviceWorker?.controller;
  if (!worker) return Promise.resolve();
  return new Promise((resolve) => {
    const channel = new MessageChannel();
    const timer = setTimeout(resolve, DELETE_WAIT_MS);
    channel.port1.onmessage = () => {
      clearTimeout(timer);
      resolve();
    };
    worker.postMessage({ type: SW_MESSAGES.clear }, [channel.port2]);
  });
}

/** Deletes everything of the app's kept on this device (the precached app shell stays: it holds
 * the build's scripts and the offline page, nothing of anyone's). */
export async function clearDeviceData(): Promise<void> {
  const work: Promise<unknown>[] = [tellWorker()];
  if ("caches" in window) {
    work.push(
      caches
        .keys()
        .then((names) =>
          Promise.all(
            names
              .filter((n) => (Object.values(FIELD_CACHES) as string[]).includes(n))
              .map((n) => caches.delete(n)),
          ),
        ),
    );
  }
  if ("indexedDB" in window && typeof indexedDB.databases === "function") {
    work.push(
      indexedDB.databases().then((dbs) =>
        Promise.all(
          dbs
            .map((d) => d.name)
            .filter((n): n is string => !!n && !n.startsWith("serwist"))
            .map(deleteDatabase),
        ),
      ),
    );
  }
  await Promise.allSettled(work);
  try {
    const keys = Array.from({ length: localStorage.length }, (_, i) => localStorage.key(i));
    for (const k of keys) if (k?.startsWith("sward:")) localStorage.removeItem(k);
  } catch {
    // storage disabled: nothing was kept there
  }
}

let settled: { userId: string; done: Promise<void> } | null = null;

/**
 * Makes sure what the phone keeps is this person's: when someone else used the app on it last
 * (and did not sign out), their data is deleted first. Resolves when the device is ready.
 */
export function claimDevice(userId: string): Promise<void> {
  if (settled?.userId === userId) return settled.done;
  const done = (async () => {
    let previous: string | null = null;
    try {
      previous = localStorage.getItem(OWNER_KEY);
    } catch {
      return;
    }
    if (previous !== null && previous !== userId) await clearDeviceData();
    try {
      localStorage.setItem(OWNER_KEY, userId);
    } catch {
      // storage full or disabled: checked again on the next page
    }
  })();
  settled = { userId, done };
  return done;
}
