import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

const sharedSource = fileURLToPath(new URL('../shared/src/index.ts', import.meta.url));
// npm run dev moves the server with PORT (default 3000); the dev server's own port is DEV_CLIENT_PORT.
const server = `http://127.0.0.1:${process.env.PORT ?? 3000}`;

export default defineConfig({
  plugins: [react()],
  resolve: {
    // The client bundles the shared TypeScript source directly, so a change in shared/ needs no
    // separate build step during development.
    alias: { '@morrowline/shared': sharedSource },
  },
  server: {
    host: '127.0.0.1',
    port: Number(process.env.DEV_CLIENT_PORT ?? 5173),
    proxy: {
      '/api': { target: server, changeOrigin: false },
      '/socket.io': { target: server, ws: true, changeOrigin: false },
    },
  },
  preview: { host: '127.0.0.1' },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    sourcemap: true,
    rolldownOptions: {
      output: {
        // Libraries change far less often than our screens: a separate chunk stays cached.
        codeSplitting: {
          groups: [
            { name: 'mantine', test: /node_modules[\\/]@mantine/ },
            { name: 'vendor', test: /node_modules/ },
          ],
        },
      },
    },
  },
});
