/// <reference types="vite/client" />

interface ImportMetaEnv {
  /** The grid library's licence key for this build (see README, Licences). */
  readonly VITE_GRID_LICENSE_KEY?: string;
}
