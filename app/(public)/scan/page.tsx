import type { Metadata } from "next";
import { Scanner } from "./_components/scanner";

export const metadata: Metadata = { title: "Scan a traveller" };

export default function ScanPage() {
  return (
    <>
      <h1 className="mb-1 text-2xl font-bold">Scan a traveller</h1>
      <p className="mb-4 text-graphite-700">Point the camera at the QR code on the axle&apos;s traveller to check that its record is intact.</p>
      <Scanner />
    </>
  );
}
