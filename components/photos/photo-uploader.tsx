"use client";

// Photos on a zone check: drag and drop on a desktop; "Take photo" (rear camera) and "Choose from
// library" on a phone; several at once, each with a progress bar (upload, then processing),
// thumbnails at once; a file that failed can be dismissed, and retried only when a retry can
// succeed (no connection, a server fault, a busy server — not a file that is not a photo or too
// large). Photos already on the check can be deleted by whoever may (`canDelete`).
// With no signal (or when the upload finds none) a photo is drawn at display size on the phone and
// queued in the outbox (lib/offline) with the moment it was taken; it shows as a thumbnail marked
// "Waiting to send" until the server has it.
import { Camera, ImagePlus, RefreshCw, Trash2, Upload, X } from "lucide-react";
import { useTranslations } from "next-intl";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { useDropzone } from "react-dropzone";

import { Button } from "@/components/ui/button";
import { outbox, requestBackgroundSync } from "@/lib/offline/client";
import type { OutboxOp } from "@/lib/offline/db";
import { downscalePhoto } from "@/lib/offline/downscale";
import type { PhotoDto } from "@/lib/photos/dto";
import { createLimiter } from "@/lib/photos/limiter";

import { PhotoFigure } from "./photo-figure";

const MAX_BYTES = 25 * 1024 * 1024;
const PARALLEL = 2;

interface QueueItem {
  localId: string;
  file: File;
  previewUrl: string;
  status: "waiting" | "uploading" | "processing" | "done" | "error";
  progress: number;
  message?: string;
  /** Sending the same file again can succeed (a network or server failure, not the file itself). */
  retryable?: boolean;
}

/** Answers after which the same file can succeed: none (no connection), a conflict, busy, server faults. */
const canRetryUpload = (status: number) =>
  status === 0 || status === 408 || status === 409 || status === 429 || status >= 500;

function send(
  url: string,
  file: File,
  onProgress: (pct: number) => void,
  onUploaded: () => void,
): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.setRequestHeader("Content-Type", file.type || "application/octet-stream");
    xhr.upload.onprogress = (e) =>
      e.lengthComputable && onProgress(Math.round((100 * e.loaded) / e.total));
    xhr.upload.onload = onUploaded;
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON */
      }
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () => resolve({ status: 0, body: null });
    xhr.ontimeout = () => resolve({ status: 0, body: null });
    xhr.timeout = 120_000;
    xhr.send(file);
  });
}

/** A queued photo's thumbnail, from its blob on the phone. */
function WaitingPhoto({ op, label }: { op: OutboxOp; label: string }) {
  // Freed once drawn (the picture stays on screen).
  const url = useMemo(() => (op.blob ? URL.createObjectURL(op.blob) : null), [op.blob]);
  return (
    <figure
      className="overflow-hidden rounded-lg border border-rain bg-rain-tint"
      data-waiting-photo
    >
      {url ? (
        // eslint-disable-next-line @next/next/no-img-element -- a photo kept on the phone (blob: URL)
        <img
          src={url}
          alt=""
          onLoad={() => URL.revokeObjectURL(url)}
          className="aspect-[4/3] w-full object-cover"
        />
      ) : null}
      <figcaption className="p-2 text-sm font-semibold">
        {label}
        {op.held ? <span className="block text-clay">{op.held.message}</span> : null}
      </figcaption>
    </figure>
  );
}

export function PhotoUploader({
  visitId,
  zoneId,
  ensureSaved,
  ensureQueued,
  waiting = [],
  photos,
  onUploaded,
  disabled,
  uploadQuery = "",
  canDelete,
  onDelete,
}: {
  visitId: string;
  zoneId: string;
  ensureSaved: () => Promise<string>;
  /** The zone check's id once its save waits in the outbox (a photo queued offline follows it). */
  ensureQueued: () => Promise<string>;
  /** This zone's photos waiting in the outbox. */
  waiting?: OutboxOp[];
  photos: PhotoDto[];
  onUploaded: (photo: PhotoDto) => void;
  disabled: boolean;
  /** Added to the upload's address (a correction's reason on a finished visit). */
  uploadQuery?: string;
  canDelete?: (photo: PhotoDto) => boolean;
  onDelete?: (photo: PhotoDto) => void;
}) {
  const t = useTranslations("offline");
  const [queue, setQueue] = useState<QueueItem[]>([]);
  const [queuedNote, setQueuedNote] = useState(false);
  const [limit] = useState(() => createLimiter(PARALLEL));
  const cameraInput = useRef<HTMLInputElement>(null);
  const patch = (localId: string, change: Partial<QueueItem>) =>
    setQueue((q) => q.map((item) => (item.localId === localId ? { ...item, ...change } : item)));

  const correctionReason = new URLSearchParams(uploadQuery).get("correctionReason");
  /** Keeps the photo on the phone (display size) in the outbox; false when it could not be. */
  const queueOnPhone = useCallback(
    async (file: File): Promise<boolean> => {
      try {
        const capturedAt = new Date().toISOString();
        const zoneCheckId = await ensureQueued();
        const blob = await downscalePhoto(file);
        await outbox().enqueue({
          kind: "photo",
          visitId,
          zoneId,
          clientId: crypto.randomUUID(),
          payload: { zoneCheckId, ...(correctionReason ? { correctionReason } : {}) },
          blob,
          capturedAt,
        });
        requestBackgroundSync();
        setQueuedNote(true);
        void outbox().replay();
        return true;
      } catch {
        return false;
      }
    },
    [correctionReason, ensureQueued, visitId, zoneId],
  );

  const upload = useCallback(
    (item: QueueItem) =>
      limit(async () => {
        patch(item.localId, { status: "uploading", progress: 0, message: undefined });
        try {
          const zoneCheckId = await ensureSaved();
          const { status, body } = await send(
            `/api/v1/visits/${visitId}/zone-checks/${zoneCheckId}/photos${uploadQuery}`,
            item.file,
            (progress) => patch(item.localId, { progress }),
            () => patch(item.localId, { status: "processing", progress: 100 }),
          );
          if (status === 200 || status === 201) {
            patch(item.localId, { status: "done" });
            onUploaded(body as PhotoDto);
          } else if (status === 0 && (await queueOnPhone(item.file))) {
            // No signal after all: the outbox has it now.
            setQueue((q) => q.filter((x) => x.localId !== item.localId));
          } else {
            const message =
              (body as { error?: { message?: string } } | null)?.error?.message ??
              (status === 0
                ? "No connection. The photo is still here; retry when you have signal."
                : `The server answered ${status}.`);
            patch(item.localId, { status: "error", message, retryable: canRetryUpload(status) });
          }
        } catch (err) {
          patch(item.localId, {
            status: "error",
            message: err instanceof Error ? err.message : "Upload failed.",
            retryable: true,
          });
        }
      }),
    [ensureSaved, limit, onUploaded, queueOnPhone, uploadQuery, visitId],
  );

  // Previews are blob: URLs; free them when the uploader goes away.
  const previews = useRef<string[]>([]);
  useEffect(() => {
    const urls = previews.current;
    return () => urls.forEach((url) => URL.revokeObjectURL(url));
  }, []);

  const add = useCallback(
    (files: File[]) => {
      if (!navigator.onLine) {
        for (const file of files)
          if (file.size > 0 && file.size <= MAX_BYTES) void queueOnPhone(file);
        return;
      }
      const items = files.map<QueueItem>((file) => ({
        localId: crypto.randomUUID(),
        file,
        previewUrl: URL.createObjectURL(file),
        status: file.size > MAX_BYTES ? "error" : file.size === 0 ? "error" : "waiting",
        progress: 0,
        message:
          file.size > MAX_BYTES
            ? "The photo is larger than 25 MB. Send a smaller copy."
            : file.size === 0
              ? "The file is empty. Choose the photo again."
              : undefined,
      }));
      previews.current.push(...items.map((i) => i.previewUrl));
      setQueue((q) => [...q, ...items]);
      for (const item of items) if (item.status === "waiting") void upload(item);
    },
    [queueOnPhone, upload],
  );

  const { getRootProps, getInputProps, isDragActive, open } = useDropzone({
    onDrop: add,
    noClick: true,
    noKeyboard: true,
    multiple: true,
    disabled,
  });
  const pending = queue.filter((q) => q.status !== "done");

  const waitingPhotos = waiting.filter((op) => op.kind === "photo" && op.zoneId === zoneId);
  return (
    <div className="space-y-3">
      {waitingPhotos.length ? (
        <ul className="grid grid-cols-2 gap-3" aria-label="Photos waiting to send">
          {waitingPhotos.map((op) => (
            <li key={op.seq}>
              <WaitingPhoto op={op} label={t("photoWaiting")} />
            </li>
          ))}
        </ul>
      ) : null}
      {queuedNote && waitingPhotos.length ? (
        <p className="text-sm text-muted" role="status">
          {t("photoQueued")}
        </p>
      ) : null}
      {photos.length ? (
        <ul className="grid grid-cols-2 gap-3" aria-label="Photos of this zone check">
          {photos.map((p) => (
            <li key={p.id}>
              <PhotoFigure photo={p} />
              {onDelete && canDelete?.(p) ? (
                <Button
                  type="button"
                  variant="secondary"
                  className="mt-1 w-full"
                  onClick={() => onDelete(p)}
                  aria-label={`Delete this photo (${Math.round(p.greenCoverPct)} % green cover)`}
                >
                  <Trash2 className="size-5" aria-hidden="true" />
                  Delete photo
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      <div
        {...getRootProps({
          className: `rounded-xl border-2 border-dashed p-4 text-center ${isDragActive ? "border-sward bg-sward-tint" : "border-line bg-paper"}`,
        })}
      >
        <input {...getInputProps({ "aria-label": "Choose photos from the library" })} />
        <p className="mb-3 hidden items-center justify-center gap-2 font-semibold sm:flex">
          <Upload className="size-5" aria-hidden="true" />
          {isDragActive ? "Drop the photos here" : "Drag photos here, or"}
        </p>
        <div className="grid grid-cols-2 gap-2">
          <Button type="button" disabled={disabled} onClick={() => cameraInput.current?.click()}>
            <Camera className="size-5" aria-hidden="true" />
            Take photo
          </Button>
          <Button type="button" variant="secondary" disabled={disabled} onClick={open}>
            <ImagePlus className="size-5" aria-hidden="true" />
            Choose from library
          </Button>
        </div>
        <input
          ref={cameraInput}
          type="file"
          accept="image/*"
          capture="environment"
          className="sr-only"
          tabIndex={-1}
          aria-label="Take a photo with the camera"
          onChange={(e) => {
            add(Array.from(e.target.files ?? []));
            e.target.value = "";
          }}
        />
        <p className="mt-2 text-sm text-muted">JPEG, PNG or WebP, up to 25 MB each.</p>
      </div>
      {pending.length ? (
        <ul className="space-y-2" aria-label="Uploads">
          {pending.map((item) => (
            <li
              key={item.localId}
              className="flex items-center gap-3 rounded-lg border border-line bg-card p-2"
            >
              {/* eslint-disable-next-line @next/next/no-img-element -- a local preview (blob: URL) of the file being sent */}
              <img src={item.previewUrl} alt="" className="size-14 shrink-0 rounded object-cover" />
              <div className="min-w-0 flex-1">
                <p className="truncate text-sm font-semibold">{item.file.name || "Photo"}</p>
                {item.status === "error" ? (
                  <p role="alert" className="text-sm text-clay">
                    {item.message}
                  </p>
                ) : (
                  <>
                    <progress
                      className="h-2 w-full accent-sward"
                      max={100}
                      value={item.status === "processing" ? undefined : item.progress}
                      aria-label={`Upload of ${item.file.name || "photo"}`}
                    />
                    <p className="text-sm text-muted" role="status">
                      {item.status === "waiting"
                        ? "Waiting…"
                        : item.status === "uploading"
                          ? `Uploading ${item.progress} %`
                          : "Measuring cover and color…"}
                    </p>
                  </>
                )}
              </div>
              {item.status === "error" && item.retryable ? (
                <Button
                  type="button"
                  variant="secondary"
                  onClick={() => {
                    patch(item.localId, { status: "waiting", message: undefined });
                    void upload(item);
                  }}
                  aria-label={`Retry ${item.file.name || "photo"}`}
                >
                  <RefreshCw className="size-5" aria-hidden="true" />
                  Retry
                </Button>
              ) : null}
              {item.status === "error" ? (
                <Button
                  type="button"
                  variant="secondary"
                  onClick={() => setQueue((q) => q.filter((x) => x.localId !== item.localId))}
                  aria-label={`Dismiss ${item.file.name || "photo"}`}
                >
                  <X className="size-5" aria-hidden="true" />
                  Dismiss
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
