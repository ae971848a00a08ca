import type { Metadata, Viewport } from "next";
import { connection } from "next/server";
import { figureFace, textFace } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Gusset", template: "%s · Gusset" },
  description: "Signed weld records, hold points and sealed travellers for axle and frame bracket work.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#171b1a" };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page renders per request: its scripts carry that request's CSP nonce (set in proxy.ts), which a
  // page built ahead of time could not.
  await connection();
  return (
    <html lang="en" className={`${textFace.variable} ${figureFace.variable}`}>
      <body className="font-sans text-graphite-950 antialiased">{children}</body>
    </html>
  );
}
