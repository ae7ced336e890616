import type { MetadataRoute } from "next";

// Lets people add Shoal to the home screen of a phone; icons are generated locally (app/icons/).
export default function manifest(): MetadataRoute.Manifest {
  return {
    name: "Shoal — fish farming, started right",
    short_name: "Shoal",
    description: "Find tank builders and fingerling hatcheries near you, plan your first tank, and pay safely.",
    start_url: "/",
    display: "standalone",
    background_color: "#f7f6f3",
    theme_color: "#176d64",
    icons: [
      { src: "/icons/192", sizes: "192x192", type: "image/png" },
      { src: "/icons/512", sizes: "512x512", type: "image/png" },
      { src: "/icons/512", sizes: "512x512", type: "image/png", purpose: "maskable" },
    ],
  };
}
