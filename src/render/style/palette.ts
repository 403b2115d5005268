/**
 * Colours: the Okabe–Ito palette (Okabe & Ito, "Color Universal Design",
 * 2008), distinguishable with the common forms of colour-vision deficiency
 * and in grey-scale print when combined with the dash patterns below. Each
 * quantity keeps its colour and dash in every figure.
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
} as const;

/** What each curve or mark is drawn with. */
export const SERIES_STYLE = {
  loop: { colour: OKABE_ITO.vermillion, dash: null },
  sensitivity: { colour: OKABE_ITO.blue, dash: '7 4' },
  complementarySensitivity: { colour: OKABE_ITO.bluishGreen, dash: '2 3' },
  control: { colour: OKABE_ITO.blue, dash: null },
  loadResponse: { colour: OKABE_ITO.bluishGreen, dash: null },
  marks: { colour: OKABE_ITO.reddishPurple, dash: null },
  sensitivityCircle: { colour: OKABE_ITO.orange, dash: '5 3' },
} as const;

export type SeriesName = keyof typeof SERIES_STYLE;
