/**
 * Colours from the Okabe–Ito palette (Okabe & Ito, "Color Universal Design", 2008), safe for
 * the common colour-vision deficiencies. Colour never carries meaning alone: every chip has
 * its word, and day 2 is also drawn dashed.
 */
export const OKABE_ITO = {
  black: '#000000',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
  grey: '#999999',
} as const;

export const DAY_COLOUR = { 1: OKABE_ITO.blue, 2: OKABE_ITO.orange } as const;
export const THRESHOLD_COLOUR = { vt1: OKABE_ITO.bluishGreen, vt2: OKABE_ITO.reddishPurple } as const;

export const VERDICT_STYLE = {
  held: { colour: OKABE_ITO.bluishGreen, words: 'Reproduced' },
  fell: { colour: OKABE_ITO.vermillion, words: 'Lower on day 2' },
  rose: { colour: OKABE_ITO.skyBlue, words: 'Higher on day 2' },
  open: { colour: OKABE_ITO.yellow, words: 'Undetermined' },
  not_comparable: { colour: OKABE_ITO.grey, words: 'Not comparable' },
} as const;
