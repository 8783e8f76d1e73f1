/** Software version recorded in every result and report. Keep in step with package.json. */
export const SOFTWARE_NAME = 'Twofold';
export const SOFTWARE_VERSION = '0.1.0';
