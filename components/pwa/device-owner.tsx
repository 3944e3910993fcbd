"use client";

// Placed in the signed-in frame: claims the phone's kept data for the person signed in
// (device-data.ts), so nothing of the last person's stays when someone else signs in.
import { useEffect } from "react";

import { claimDevice } from "./device-data";

export function DeviceOwner({ userId }: { userId: string }) {
  useEffect(() => {
    void claimDevice(userId);
  }, [userId]);
  return null;
}
