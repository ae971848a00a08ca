"use client";
import jsQR from "jsqr";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { normalisePaperSeal, PAPER_SEAL_MIN, sealFromScan, verifyPath } from "@/lib/records/paper-seal";
import { tokenFromScan } from "@/lib/records/token";

type Detector = { detect: (source: CanvasImageSource) => Promise<{ rawValue: string }[]> };

// Reads the traveller's QR with the browser's BarcodeDetector where there is one, else with jsQR on video frames.
export function Scanner() {
  const router = useRouter();
  const video = useRef<HTMLVideoElement>(null);
  const canvas = useRef<HTMLCanvasElement>(null);
  const [running, setRunning] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [typed, setTyped] = useState("");
  const [typedError, setTypedError] = useState<string | null>(null);
  const [typedSeal, setTypedSeal] = useState("");
  const [sealError, setSealError] = useState<string | null>(null);

  useEffect(() => {
    if (!running) return;
    let stream: MediaStream | null = null;
    let frame = 0;
    let stopped = false;
    const w = window as unknown as { BarcodeDetector?: new (o: { formats: string[] }) => Detector };
    const detector = w.BarcodeDetector ? new w.BarcodeDetector({ formats: ["qr_code"] }) : null;
    const found = (text: string) => {
      const token = tokenFromScan(text);
      if (token) {
        stopped = true;
        router.push(verifyPath(token, sealFromScan(text)));
      } else setMessage("That code is not a Gusset traveller code.");
    };
    const tick = async () => {
      if (stopped) return;
      const v = video.current;
      const c = canvas.current;
      if (v && c && v.readyState >= 2) {
        if (detector) {
          const codes = await detector.detect(v).catch(() => []);
          if (codes[0]) return found(codes[0].rawValue);
        } else {
          c.width = v.videoWidth;
          c.height = v.videoHeight;
          const g = c.getContext("2d", { willReadFrequently: true });
          if (g) {
            g.drawImage(v, 0, 0);
            const img = g.getImageData(0, 0, c.width, c.height);
            const code = jsQR(img.data, img.width, img.height);
            if (code) return found(code.data);
          }
        }
      }
      frame = requestAnimationFrame(() => void tick());
    };
    navigator.mediaDevices
      ?.getUserMedia({ video: { facingMode: "environment" } })
      .then((s) => {
        stream = s;
        if (video.current) {
          video.current.srcObject = s;
          void video.current.play();
        }
        setMessage("Hold the traveller's code inside the frame.");
        void tick();
      })
      .catch(() => {
        setMessage("The camera is not available here. Type the code printed under the QR instead.");
        setRunning(false);
      });
    return () => {
      stopped = true;
      cancelAnimationFrame(frame);
      stream?.getTracks().forEach((t) => t.stop());
    };
  }, [running, router]);

  return (
    <div className="space-y-4">
      <section className="card space-y-3 p-4">
        <div className="relative aspect-video overflow-hidden rounded-md bg-graphite-900">
          <video ref={video} className="h-full w-full object-cover" muted playsInline aria-label="Camera view" />
          {!running ? <p className="absolute inset-0 flex items-center justify-center p-4 text-center text-graphite-100">Camera off</p> : null}
        </div>
        <canvas ref={canvas} className="hidden" />
        <button type="button" className="btn btn-primary min-h-12 w-full" onClick={() => setRunning((r) => !r)}>
          {running ? "Stop the camera" : "Start the camera"}
        </button>
        <p className="min-h-6 text-sm text-graphite-700" aria-live="polite" data-testid="scan-message">{message}</p>
      </section>
      <form
        className="card space-y-2 p-4"
        onSubmit={(e) => {
          e.preventDefault();
          const token = tokenFromScan(typed);
          const sealText = typedSeal.trim();
          const seal = sealText ? normalisePaperSeal(sealText) : sealFromScan(typed);
          if (!token) setTypedError("That is not a traveller code: it is the 27 letters and digits printed under the QR, or the whole link.");
          if (sealText && !seal) setSealError(`The seal is at least the first ${PAPER_SEAL_MIN} letters a–f and digits printed beside "Seal"; spaces do not matter.`);
          if (!token || (sealText && !seal)) return;
          router.push(verifyPath(token, seal));
        }}
      >
        <label className="field-label" htmlFor="typed">Or type the code printed under the QR</label>
        <input id="typed" className="field-input figures" value={typed} onChange={(e) => { setTyped(e.target.value); setTypedError(null); }} autoComplete="off" aria-invalid={typedError ? true : undefined} aria-describedby="typed-error" />
        <p className="field-error" id="typed-error">{typedError}</p>
        <label className="field-label" htmlFor="typed-seal">Seal printed on the traveller (optional: compares the paper with the record)</label>
        <input id="typed-seal" className="field-input figures" value={typedSeal} onChange={(e) => { setTypedSeal(e.target.value); setSealError(null); }} autoComplete="off" inputMode="text" placeholder="e.g. 3f9a 07c1 5be2 d468" aria-invalid={sealError ? true : undefined} aria-describedby="typed-seal-error" data-testid="typed-seal" />
        <p className="field-error" id="typed-seal-error">{sealError}</p>
        <button type="submit" className="btn btn-quiet min-h-12">Check the record</button>
      </form>
    </div>
  );
}
