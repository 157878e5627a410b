/** Defined in vite.config.ts: true when the build carries the development tools (the local mail inbox). */
declare const __TACKLINE_DEV_TOOLS__: boolean;
