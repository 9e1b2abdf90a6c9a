// The virtual module vite-plugin-pwa serves (vite.config.ts): registerSW for the app's own update prompt.
/// <reference types="vite-plugin-pwa/vanillajs" />
