import react from '@vitejs/plugin-react';
import { defineConfig, type Plugin } from 'vite';
import { offlineCache } from './app/offline/service-worker-plugin.ts';

// The built page may load only its own files: no fonts, scripts or requests from elsewhere, no eval.
// Styles allow 'unsafe-inline' because Plotly writes its own <style> and style attributes.
// Build only: the dev server injects an inline script for hot reload.
const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  // Workers (the converter's trace reader, the offline cache) come from the page's own files only.
  "worker-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'none'",
].join('; ');

function contentSecurityPolicy(): Plugin {
  return {
    name: 'sekundo-content-security-policy',
    apply: 'build',
    transformIndexHtml: () => [
      { tag: 'meta', attrs: { 'http-equiv': 'Content-Security-Policy', content: CONTENT_SECURITY_POLICY }, injectTo: 'head-prepend' },
    ],
  };
}

// The app shell lives in app/; static files (demo data, icons) in public/.
// `base: './'` makes the built files work from any static file server or folder.
export default defineConfig({
  root: 'app',
  publicDir: '../public',
  base: './',
  plugins: [react(), contentSecurityPolicy(), offlineCache()],
  build: {
    outDir: '../dist',
    emptyOutDir: true,
    chunkSizeWarningLimit: 4000,
  },
  server: { host: '127.0.0.1', strictPort: true },
  preview: { host: '127.0.0.1', strictPort: true },
});
