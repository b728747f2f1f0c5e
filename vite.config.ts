import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";

// The API server listens on PORT (default 4100); in dev and preview vite proxies /api to it so
// the client stays same-origin and session cookies and CSRF work exactly as in production.
const apiTarget = `http://127.0.0.1:${process.env.PORT ?? "4100"}`;
const proxy = { "/api": { target: apiTarget, changeOrigin: false } };

export default defineConfig({
  plugins: [react(), tailwindcss()],
  server: { host: "127.0.0.1", port: 5173, strictPort: true, proxy },
  preview: { host: "127.0.0.1", proxy },
  build: {
    outDir: "dist",
    emptyOutDir: true,
    chunkSizeWarningLimit: 300,
    rolldownOptions: {
      output: {
        // Stable vendor chunks cache across deploys. Form and schema code is only reached from
        // lazy routes, so it gets its own group to stay out of the initial page; anything not
        // listed (charts, barcode code) follows the lazy route that imports it.
        codeSplitting: {
          groups: [
            { name: "react", test: /node_modules[\\/](react|react-dom|scheduler)[\\/]/ },
            { name: "router", test: /node_modules[\\/](react-router|react-router-dom|cookie|set-cookie-parser)[\\/]/ },
            { name: "query", test: /node_modules[\\/]@tanstack[\\/]/ },
            { name: "forms", test: /node_modules[\\/](react-hook-form|@hookform|zod)[\\/]/ },
          ],
        },
      },
    },
  },
});
