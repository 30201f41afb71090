"use client";
// The Scan screen: reads a marker's barcode with the camera (or a typed code, or a handheld scanner that types the
// code and Enter), checks the code with the trace API, then opens the run's trace page.
import { useCallback, useEffect, useRef, useState, type FormEvent } from "react";
import { useRouter } from "next/navigation";
import { ApiError, fetcher } from "@/lib/client/fetcher";
import { createFrameDecoder, type DecoderEngine, type FrameDecoder } from "@/lib/client/barcode-reader";
import { normaliseTraceCode } from "@/lib/domain/trace-code";
import type { TraceView } from "@/lib/services/trace";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

type Camera =
  | { kind: "idle" }
  | { kind: "starting" }
  | { kind: "scanning"; engine: DecoderEngine }
  | { kind: "no-camera" }
  | { kind: "insecure" }
  | { kind: "denied" }
  | { kind: "failed"; message: string };

type Lookup =
  | { kind: "none" }
  | { kind: "checking"; code: string }
  | { kind: "found"; code: string; wireId: string; circuit: string | null; project: string }
  | { kind: "not-found"; code: string }
  | { kind: "not-a-marker"; text: string }
  | { kind: "error"; code: string; message: string };

/** How long the same unreadable or unknown barcode is ignored, so it is not looked up again and again. */
const REPEAT_MS = 4000;
const FRAME_GAP_MS = 120;

function cameraProblem(e: unknown): Camera {
  const name = e instanceof DOMException || e instanceof Error ? e.name : "";
  if (name === "NotAllowedError" || name === "SecurityError") return { kind: "denied" };
  if (name === "NotFoundError" || name === "OverconstrainedError" || name === "DevicesNotFoundError") {
    return { kind: "no-camera" };
  }
  if (name === "NotReadableError" || name === "TrackStartError") {
    return { kind: "failed", message: "The camera is in use by another app or could not be started." };
  }
  return { kind: "failed", message: e instanceof Error ? e.message : "The camera could not be started." };
}

export function ScanScreen() {
  const router = useRouter();
  const videoRef = useRef<HTMLVideoElement>(null);
  const inputRef = useRef<HTMLInputElement>(null);
  const streamRef = useRef<MediaStream | null>(null);
  const decoderRef = useRef<FrameDecoder | null>(null);
  const loopRef = useRef(0);
  const lastRef = useRef<{ text: string; at: number } | null>(null);
  const [camera, setCamera] = useState<Camera>({ kind: "idle" });
  const [lookup, setLookup] = useState<Lookup>({ kind: "none" });
  const [typed, setTyped] = useState("");
  const [typedError, setTypedError] = useState<string | null>(null);

  const stopCamera = useCallback(() => {
    loopRef.current++;
    streamRef.current?.getTracks().forEach((t) => t.stop());
    streamRef.current = null;
    if (videoRef.current) videoRef.current.srcObject = null;
  }, []);

  /** Checks a code with the API first: a code of another team, or no run at all, is "not found". */
  const open = useCallback(
    async (raw: string, source: "camera" | "typed") => {
      const code = normaliseTraceCode(raw);
      if (!code) {
        if (source === "typed") {
          setTypedError(
            "A marker code is 8 letters and digits, e.g. 7K3M9Q2X, or a trace link ending in /r/…",
          );
        } else {
          setLookup({ kind: "not-a-marker", text: raw.slice(0, 80) });
        }
        return false;
      }
      setTypedError(null);
      setLookup({ kind: "checking", code });
      try {
        const view = await fetcher<TraceView>(`/api/trace/${code}`);
        setLookup({
          kind: "found",
          code,
          wireId: view.run.wireId,
          circuit: view.run.circuit,
          project: view.project.name,
        });
        stopCamera();
        router.push(`/r/${code}`);
        return true;
      } catch (e) {
        if (e instanceof ApiError && e.status === 404) setLookup({ kind: "not-found", code });
        else if (e instanceof ApiError && e.status === 401)
          router.push(`/sign-in?next=${encodeURIComponent("/scan")}`);
        else
          setLookup({
            kind: "error",
            code,
            message: e instanceof Error ? e.message : "The code could not be checked.",
          });
        return false;
      }
    },
    [router, stopCamera],
  );

  const startCamera = useCallback(async () => {
    if (!navigator.mediaDevices?.getUserMedia) {
      setCamera(window.isSecureContext ? { kind: "no-camera" } : { kind: "insecure" });
      return;
    }
    setCamera({ kind: "starting" });
    setLookup({ kind: "none" });
    try {
      const stream = await navigator.mediaDevices.getUserMedia({
        video: { facingMode: { ideal: "environment" }, width: { ideal: 1280 }, height: { ideal: 720 } },
        audio: false,
      });
      streamRef.current = stream;
      const video = videoRef.current!;
      video.srcObject = stream;
      await video.play().catch(() => undefined);
      decoderRef.current ??= await createFrameDecoder();
      const decoder = decoderRef.current;
      setCamera({ kind: "scanning", engine: decoder.engine });
      const loop = ++loopRef.current;
      const tick = async () => {
        if (loop !== loopRef.current) return;
        let text: string | null = null;
        try {
          text = await decoder.decode(video);
        } catch {
          text = null;
        }
        if (loop !== loopRef.current) return;
        const last = lastRef.current;
        if (text && !(last && last.text === text && Date.now() - last.at < REPEAT_MS)) {
          lastRef.current = { text, at: Date.now() };
          if (await open(text, "camera")) return;
        }
        window.setTimeout(() => void tick(), FRAME_GAP_MS);
      };
      void tick();
    } catch (e) {
      stopCamera();
      setCamera(cameraProblem(e));
    }
  }, [open, stopCamera]);

  useEffect(() => {
    // Start by itself only when the camera was allowed before (no surprise permission prompt on arrival).
    let cancelled = false;
    const perms = navigator.permissions as Permissions | undefined;
    perms
      ?.query({ name: "camera" as PermissionName })
      .then((p) => {
        if (!cancelled && p.state === "granted") void startCamera();
      })
      .catch(() => undefined);
    // A desk with a handheld scanner types into the focused field; a phone keeps its keyboard down.
    if (window.matchMedia?.("(pointer: fine)").matches) inputRef.current?.focus();
    return () => {
      cancelled = true;
      stopCamera();
    };
  }, [startCamera, stopCamera]);

  function submitTyped(e: FormEvent) {
    e.preventDefault();
    void open(typed, "typed");
  }

  const scanning = camera.kind === "scanning" || camera.kind === "starting";
  return (
    <div className="mx-auto flex w-full max-w-xl flex-col gap-4">
      <h1 className="text-2xl font-bold">Scan a marker</h1>

      <section aria-label="Camera" className="flex flex-col gap-3">
        <div
          className={`relative overflow-hidden rounded-lg bg-ink ${scanning ? "" : "hidden"}`}
          style={{ aspectRatio: "4 / 3" }}
        >
          <video
            ref={videoRef}
            muted
            playsInline
            autoPlay
            aria-label="Camera view"
            className="h-full w-full object-cover"
          />
          <div aria-hidden="true" className="pointer-events-none absolute inset-[12%] rounded-md">
            <span className="absolute left-0 top-0 h-8 w-8 border-l-4 border-t-4 border-copper" />
            <span className="absolute right-0 top-0 h-8 w-8 border-r-4 border-t-4 border-copper" />
            <span className="absolute bottom-0 left-0 h-8 w-8 border-b-4 border-l-4 border-copper" />
            <span className="absolute bottom-0 right-0 h-8 w-8 border-b-4 border-r-4 border-copper" />
          </div>
          {camera.kind === "starting" ? (
            <p className="absolute inset-x-0 bottom-3 text-center text-sm font-semibold text-paper">
              Starting the camera…
            </p>
          ) : null}
        </div>

        {camera.kind === "scanning" ? (
          <div className="flex flex-wrap items-center justify-between gap-2">
            <p role="status" className="text-sm font-semibold">
              Looking for a barcode — hold the marker inside the corners.
              <span className="block text-xs font-normal text-ink-faint">
                Code 128, Data Matrix or QR ·{" "}
                {camera.engine === "native" ? "the browser's barcode reader" : "the built-in decoder"}
              </span>
            </p>
            <Button
              variant="secondary"
              size="lg"
              onClick={() => {
                stopCamera();
                setCamera({ kind: "idle" });
              }}
            >
              Stop camera
            </Button>
          </div>
        ) : null}

        {camera.kind === "idle" ? (
          <div className="flex flex-col items-center gap-3 rounded-lg border border-dashed border-line-strong bg-white/60 px-6 py-8 text-center">
            <CameraIcon />
            <p className="max-w-sm text-sm text-ink-soft">
              Point the phone or laptop camera at the barcode on a wire&apos;s marker to open its trace page.
            </p>
            <Button size="lg" onClick={() => void startCamera()}>
              Start camera
            </Button>
          </div>
        ) : null}

        {camera.kind === "no-camera" ? (
          <Notice tone="info" title="No camera found">
            <p>
              This device has no camera the browser can use. Type the code printed under the barcode below, or
              use a handheld scanner.
            </p>
            <Button variant="secondary" size="lg" className="mt-2" onClick={() => void startCamera()}>
              Look again
            </Button>
          </Notice>
        ) : null}
        {camera.kind === "insecure" ? (
          <Notice tone="info" title="The camera needs a secure connection">
            Browsers allow the camera only on https:// addresses (or on this computer itself). Type the code
            below instead.
          </Notice>
        ) : null}
        {camera.kind === "denied" ? (
          <Notice tone="caution" title="Camera permission denied">
            <p>
              Allow the camera for this site in the browser (the camera symbol in the address bar, or the site
              settings), then try again. You can also type the code below.
            </p>
            <Button variant="secondary" size="lg" className="mt-2" onClick={() => void startCamera()}>
              Try again
            </Button>
          </Notice>
        ) : null}
        {camera.kind === "failed" ? (
          <Notice tone="error" title="The camera could not be started">
            <p>{camera.message}</p>
            <Button variant="secondary" size="lg" className="mt-2" onClick={() => void startCamera()}>
              Try again
            </Button>
          </Notice>
        ) : null}
      </section>

      <div aria-live="polite" className="flex flex-col gap-2">
        {lookup.kind === "checking" ? (
          <p role="status" className="rounded-md bg-white px-4 py-3 text-sm font-semibold">
            Looking up {lookup.code}…
          </p>
        ) : null}
        {lookup.kind === "found" ? (
          <Notice tone="ok" title={`Found ${lookup.wireId}`}>
            {lookup.circuit ?? "No circuit name"} · {lookup.project}. Opening its trace page…
          </Notice>
        ) : null}
        {lookup.kind === "not-found" ? (
          <Notice tone="error" title="No run with that code">
            No run of your team has the code <span className="font-mono font-semibold">{lookup.code}</span>.
            It may be a marker of another team, or of a run that was deleted. Check the code and try again.
          </Notice>
        ) : null}
        {lookup.kind === "not-a-marker" ? (
          <Notice tone="caution" title="Not a marker's barcode">
            The camera read “<span className="font-mono">{lookup.text}</span>”, which is not a trace code. Aim
            at the barcode on a wire&apos;s marker.
          </Notice>
        ) : null}
        {lookup.kind === "error" ? (
          <Notice tone="error" title="The code could not be checked">
            <p>{lookup.message}</p>
            <Button
              variant="secondary"
              size="lg"
              className="mt-2"
              onClick={() => void open(lookup.code, "typed")}
            >
              Try again
            </Button>
          </Notice>
        ) : null}
      </div>

      <form onSubmit={submitTyped} className="flex flex-col gap-2 rounded-lg border border-line bg-white p-4">
        <label htmlFor="scan-code" className="text-sm font-semibold">
          Marker code or trace link
        </label>
        <div className="flex gap-2">
          <input
            id="scan-code"
            ref={inputRef}
            value={typed}
            onChange={(e) => {
              setTyped(e.target.value);
              setTypedError(null);
            }}
            autoComplete="off"
            autoCapitalize="characters"
            spellCheck={false}
            enterKeyHint="go"
            placeholder="7K3M9Q2X"
            aria-invalid={typedError ? true : undefined}
            aria-describedby={typedError ? "scan-code-error" : "scan-code-hint"}
            className={`h-14 min-w-0 flex-1 rounded-md border bg-white px-3 font-mono text-xl uppercase tracking-wider placeholder:tracking-normal ${typedError ? "border-fail" : "border-line-strong"}`}
          />
          <Button type="submit" size="lg" disabled={lookup.kind === "checking"}>
            Open
          </Button>
        </div>
        {typedError ? (
          <p id="scan-code-error" className="text-sm text-fail">
            {typedError}
          </p>
        ) : (
          <p id="scan-code-hint" className="text-xs text-ink-faint">
            The 8 characters printed under the barcode. A handheld scanner types here and presses Enter.
          </p>
        )}
      </form>
    </div>
  );
}

function CameraIcon() {
  return (
    <svg width="56" height="56" viewBox="0 0 56 56" aria-hidden="true">
      <rect x="6" y="16" width="44" height="30" rx="5" fill="none" stroke="#b9b2a3" strokeWidth="2.5" />
      <path d="M20 16l3-6h10l3 6" fill="none" stroke="#b9b2a3" strokeWidth="2.5" strokeLinejoin="round" />
      <circle cx="28" cy="31" r="8" fill="none" stroke="#d9752f" strokeWidth="2.5" />
    </svg>
  );
}
