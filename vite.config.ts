import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { precompressPlugin } from './scripts/precompress';

const apiPort = Number(process.env.PORT ?? 3000);

export default defineConfig({
  plugins: [react(), tailwindcss(), precompressPlugin()],
  build: {
    outDir: 'dist/client',
    emptyOutDir: true,
  },
  server: {
    port: Number(process.env.VITE_PORT ?? 5173),
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
});
