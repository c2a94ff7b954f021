import { reactRouter } from "@react-router/dev/vite";
import tailwindcss from "@tailwindcss/vite";
import { defineConfig } from "vite";

export default defineConfig({
  plugins: [tailwindcss(), reactRouter()],
  resolve: { tsconfigPaths: true },
  // Kept in build/client/.vite (never served: express.static ignores dot folders) for the client
  // budget check, scripts/client-budget.ts.
  build: { manifest: true },
  server: { host: "127.0.0.1" },
});
