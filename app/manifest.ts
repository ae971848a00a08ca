import type { MetadataRoute } from "next";

// Installable on tablets and phones. "/" sends each person to the desk of their role.
export default function manifest(): MetadataRoute.Manifest {
  return {
    name: "Gusset",
    short_name: "Gusset",
    description: "Signed weld records, hold points and sealed travellers for axle and frame bracket work.",
    id: "/",
    start_url: "/",
    scope: "/",
    display: "standalone",
    orientation: "any",
    background_color: "#f4f5f4",
    theme_color: "#171b1a",
    icons: [
      { src: "/icons/icon-192.png", sizes: "192x192", type: "image/png", purpose: "any" },
      { src: "/icons/icon-512.png", sizes: "512x512", type: "image/png", purpose: "any" },
      { src: "/icons/maskable-512.png", sizes: "512x512", type: "image/png", purpose: "maskable" },
    ],
  };
}
