import type { Metadata, Viewport } from "next";
import { figureFace, textFace } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Gusset", template: "%s · Gusset" },
  description: "Signed weld records, hold points and sealed travellers for axle and frame bracket work.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#171b1a" };

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${textFace.variable} ${figureFace.variable}`}>
      <body className="font-sans text-graphite-950 antialiased">{children}</body>
    </html>
  );
}
