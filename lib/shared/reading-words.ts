// How readings are named to people: methods and seasons in plain words, never the stored codes.

export const FLOW_METHOD_WORDS: Record<string, string> = { volumetric: 'Bucket', 'v-notch': 'V-notch weir', float: 'Float' };

export const FALL_METHOD_WORDS: Record<string, string> = {
  level: 'Level and staff',
  hose: 'Hose level',
  clinometer: 'Clinometer',
  gps: 'GPS (rough)',
  barometric: 'Barometer (rough)',
  direct: 'One figure',
};

export const SEASON_WORDS: Record<string, string> = { dry: 'dry season', wet: 'wet season', unknown: 'season not known' };

/** A stored code in words; an unknown code reads as "other" rather than showing itself. */
export function wordFor(words: Record<string, string>, code: string | null | undefined): string {
  return (code && words[code]) || 'other';
}

export const POINT_ROLE_WORDS: Record<string, string> = {
  intake: 'Intake',
  pump: 'Pump site',
  tank: 'Tank',
  station: 'Creek-profile station',
  source: 'Source',
  other: 'Other point',
};
