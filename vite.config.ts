import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

// The app shell lives in app/; static files (demo data, icons) in public/.
// `base: './'` makes the built files work from any static file server or folder.
export default defineConfig({
  root: 'app',
  publicDir: '../public',
  base: './',
  plugins: [react()],
  build: {
    outDir: '../dist',
    emptyOutDir: true,
    chunkSizeWarningLimit: 4000,
  },
  server: { host: '127.0.0.1', strictPort: true },
  preview: { host: '127.0.0.1', strictPort: true },
});
