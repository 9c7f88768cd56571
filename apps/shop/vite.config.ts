import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';

const api = process.env.API_URL ?? 'http://127.0.0.1:3000';
// scripts/stack.ts sets these when STACK_PORT_OFFSET moves the stack (scripts/ports.ts)
const port = Number(process.env.SHOP_PORT ?? 5174);

export default defineConfig({
  plugins: [react(), tailwindcss()],
  // warm the module graph at start, so dependency optimisation never reloads a page under a user (or a test)
  server: {
    warmup: { clientFiles: ['./src/main.tsx'] },
    host: '127.0.0.1',
    port,
    strictPort: true,
    proxy: { '/api': { target: api, changeOrigin: false } },
  },
  preview: { host: '127.0.0.1', port, strictPort: true, proxy: { '/api': { target: api, changeOrigin: false } } },
  optimizeDeps: {
    include: [
      'react',
      'react-dom',
      'react-dom/client',
      'react/jsx-runtime',
      'react/jsx-dev-runtime',
      'react-router-dom',
      '@tanstack/react-query',
      'react-hook-form',
      '@hookform/resolvers/zod',
      'zod',
    ],
  },
  test: { environment: 'happy-dom', setupFiles: ['src/testing/setup.ts'] },
});
