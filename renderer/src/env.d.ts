/// <reference types="vite/client" />
import type { LegwiseApi } from '../../electron/contract.ts';

declare global {
  interface Window {
    /** Present only inside the desktop shell (electron/preload). */
    legwise?: LegwiseApi;
  }
}

declare module '*.vue' {
  import type { DefineComponent } from 'vue';
  const component: DefineComponent<object, object, unknown>;
  export default component;
}
