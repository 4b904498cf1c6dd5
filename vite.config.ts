import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";
import { VitePWA } from "vite-plugin-pwa";

// The dev server proxies the API so that the browser sees one origin, as it does in production
// where the Express server serves dist/ and /api on the same port.
const apiTarget = process.env.EQUIPOT_API_TARGET ?? "http://127.0.0.1:8080";

// The paper theme's page and primary colours (tailwind.config.ts `palettes.paper`), for the
// installed app's splash screen and title bar.
const paperColour = "#F5EFE2";
const primaryColour = "#12524E";

export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    VitePWA({
      strategies: "generateSW",
      // "prompt": an update waits until the person chooses to reload, so a half-filled form is
      // never lost to an automatic reload. clientsClaim lets the very first worker take control.
      registerType: "prompt",
      injectRegister: false,
      manifestFilename: "manifest.webmanifest",
      manifest: {
        id: "/",
        name: "Equipot",
        short_name: "Equipot",
        description:
          "Field, logistics and geodesy work for transportable optical clock campaigns, offline first.",
        start_url: "/",
        scope: "/",
        display: "standalone",
        orientation: "any",
        background_color: paperColour,
        theme_color: primaryColour,
        icons: [
          { src: "/icons/icon-192.png", sizes: "192x192", type: "image/png", purpose: "any" },
          { src: "/icons/icon-512.png", sizes: "512x512", type: "image/png", purpose: "any" },
          {
            src: "/icons/icon-maskable-512.png",
            sizes: "512x512",
            type: "image/png",
            purpose: "maskable",
          },
          { src: "/icons/icon.svg", sizes: "any", type: "image/svg+xml", purpose: "any" },
        ],
      },
      workbox: {
        globPatterns: ["**/*.{js,mjs,css,html,woff2,svg,png,webmanifest}"],
        // maplibre's worker (about 0.6 MB) and main chunk (about 1 MB) must be precached for the
        // map to open offline.
        maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
        navigateFallback: "/index.html",
        // API calls must reach the network (or fail): never answer them with the app shell.
        navigateFallbackDenylist: [/^\/api(\/|$)/],
        clientsClaim: true,
        skipWaiting: false,
        cleanupOutdatedCaches: true,
      },
    }),
  ],
  server: {
    proxy: { "/api": { target: apiTarget, changeOrigin: false } },
  },
  build: {
    outDir: "dist",
    sourcemap: true,
    rolldownOptions: {
      output: {
        // React changes less often than the app: its own chunk keeps updates small. There is no
        // catch-all library group: it would put every page's libraries (QR, ZIP, CSV, tables,
        // statistics) into the initial route. Each library rides with the pages that import it.
        codeSplitting: {
          groups: [
            {
              name: "react",
              test: /node_modules[\\/](react|react-dom|scheduler|react-router)[\\/]/,
            },
            // What the initial route needs besides React: the local store, the schemas and the
            // query cache. Nothing else may join this group.
            {
              name: "vendor",
              test: /node_modules[\\/](dexie|dexie-react-hooks|zod|@tanstack[\\/](query-[\w-]+|react-query[\w-]*))[\\/]/,
            },
            // The forms of sign-in and of the editing pages.
            { name: "forms", test: /node_modules[\\/](react-hook-form|@hookform[\\/][\w-]+)[\\/]/ },
            // Libraries of single pages, named so that their weight shows in the build: QR
            // scanning and labels, statistics and least squares, ZIP, CSV, the legs table. A start
            // of the board never requests them (on a first visit the tab fetches every page:
            // router.tsx, warmPagesWithoutWorker).
            { name: "qr", test: /node_modules[\\/](jsqr|qrcode|dijkstrajs)[\\/]/ },
            { name: "stats", test: /node_modules[\\/](@stdlib|ml-[\w-]+)[\\/]/ },
            { name: "zip", test: /node_modules[\\/]fflate[\\/]/ },
            { name: "csv", test: /node_modules[\\/]papaparse[\\/]/ },
            { name: "table", test: /node_modules[\\/]@tanstack[\\/](react-)?(table|virtual)/ },
            // Loaded on demand by the temperature chart.
            { name: "uplot", test: /node_modules[\\/]uplot[\\/]/ },
            // Loaded on demand by the map screen, with its bundled outlines.
            {
              name: "maplibre",
              test: /node_modules[\\/](maplibre-gl|world-atlas|topojson-client)[\\/]/,
            },
          ],
        },
      },
    },
  },
});
