import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';
import { fileURLToPath } from 'node:url';

const apiTarget = `http://127.0.0.1:${process.env.PORT ?? 3000}`;

// The installable app (issue 6): the service worker precaches the app shell and fonts so the Tally opens with no
// signal. It never handles /api/ (reads come from the persisted query cache, writes go through the Tally's
// outbox), nor /media/, /uploads/ or the server-rendered showcase pages under /p/.
const pwa = VitePWA({
  registerType: 'autoUpdate',
  injectRegister: 'script',
  includeAssets: ['whorl.svg', 'icons/*.svg', 'icons/*.png'],
  manifest: {
    name: 'Whorlbook',
    short_name: 'Whorlbook',
    description: 'Follow crochet patterns round by round, keep every count, and share what you make.',
    lang: 'en',
    start_url: '/',
    scope: '/',
    display: 'standalone',
    theme_color: '#3F6B4E',
    background_color: '#F7F1E6',
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
      { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      { src: '/icons/whorlbook.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
    ],
  },
  workbox: {
    globPatterns: ['**/*.{js,css,html,svg,png,woff2,webmanifest}'],
    navigateFallback: 'index.html',
    navigateFallbackDenylist: [/^\/api\//, /^\/media\//, /^\/uploads\//, /^\/p\//, /^\/m\//],
    cleanupOutdatedCaches: true,
    clientsClaim: true,
    skipWaiting: true,
    runtimeCaching: [],
  },
});

export default defineConfig({
  plugins: [react(), tailwindcss(), pwa],
  resolve: { alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) } },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: {
      '/api': apiTarget,
      '/uploads': apiTarget,
      '/media': apiTarget,
      '/p/': apiTarget,
      '/m/': apiTarget,
    },
  },
  build: { outDir: 'dist', sourcemap: false },
});
