/** IPC channel names shared by the main process and the preload. */
export const CHANNEL_HOST = 'twofold:host';
export const CHANNEL_COMMAND = 'twofold:command';
/** The app's own origin: the page is served from here and nowhere else. */
export const APP_SCHEME = 'twofold';
export const APP_ORIGIN = 'twofold://app';
