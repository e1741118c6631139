import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

// Where the dev server forwards /api; the NestJS server listens on 3000 unless told otherwise.
const apiTarget = process.env.STORMHOUR_API_URL ?? 'http://localhost:3000';

export default defineConfig({
  plugins: [react()],
  css: {
    // Carbon's own Sass still uses deprecated features; their warnings drown ours.
    preprocessorOptions: { scss: { quietDeps: true } },
  },
  server: {
    port: 5173,
    proxy: { '/api': apiTarget },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
  },
});
