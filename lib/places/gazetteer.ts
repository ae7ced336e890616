// Places a visitor can type instead of sharing their location. Shipped with the app,
// so finding a place costs no request. Approximate town centres (decimal degrees,
// WGS84) for the demo country and the capitals around it; from memory, good to a few km.
export type Place = { name: string; region: string; country: string; lat: number; lng: number };

export const PLACES: readonly Place[] = [
  { name: "Lusaka", region: "Lusaka", country: "ZM", lat: -15.4167, lng: 28.2833 },
  { name: "Chongwe", region: "Lusaka", country: "ZM", lat: -15.3292, lng: 28.682 },
  { name: "Kafue", region: "Lusaka", country: "ZM", lat: -15.7691, lng: 28.1814 },
  { name: "Chilanga", region: "Lusaka", country: "ZM", lat: -15.5594, lng: 28.2769 },
  { name: "Luangwa", region: "Lusaka", country: "ZM", lat: -15.62, lng: 30.41 },
  { name: "Rufunsa", region: "Lusaka", country: "ZM", lat: -15.08, lng: 29.63 },
  { name: "Kabwe", region: "Central", country: "ZM", lat: -14.4469, lng: 28.4464 },
  { name: "Chisamba", region: "Central", country: "ZM", lat: -14.9833, lng: 28.3667 },
  { name: "Mumbwa", region: "Central", country: "ZM", lat: -14.9783, lng: 27.0619 },
  { name: "Kapiri Mposhi", region: "Central", country: "ZM", lat: -13.97, lng: 28.68 },
  { name: "Chibombo", region: "Central", country: "ZM", lat: -14.66, lng: 28.08 },
  { name: "Serenje", region: "Central", country: "ZM", lat: -13.23, lng: 30.23 },
  { name: "Mkushi", region: "Central", country: "ZM", lat: -13.62, lng: 29.39 },
  { name: "Mazabuka", region: "Southern", country: "ZM", lat: -15.856, lng: 27.748 },
  { name: "Monze", region: "Southern", country: "ZM", lat: -16.2803, lng: 27.4733 },
  { name: "Siavonga", region: "Southern", country: "ZM", lat: -16.538, lng: 28.7087 },
  { name: "Choma", region: "Southern", country: "ZM", lat: -16.8065, lng: 26.987 },
  { name: "Livingstone", region: "Southern", country: "ZM", lat: -17.8419, lng: 25.8543 },
  { name: "Kalomo", region: "Southern", country: "ZM", lat: -17.03, lng: 26.48 },
  { name: "Ndola", region: "Copperbelt", country: "ZM", lat: -12.9587, lng: 28.6366 },
  { name: "Kitwe", region: "Copperbelt", country: "ZM", lat: -12.8024, lng: 28.2132 },
  { name: "Chingola", region: "Copperbelt", country: "ZM", lat: -12.5289, lng: 27.8536 },
  { name: "Mufulira", region: "Copperbelt", country: "ZM", lat: -12.55, lng: 28.24 },
  { name: "Luanshya", region: "Copperbelt", country: "ZM", lat: -13.1367, lng: 28.4166 },
  { name: "Chipata", region: "Eastern", country: "ZM", lat: -13.6333, lng: 32.65 },
  { name: "Petauke", region: "Eastern", country: "ZM", lat: -14.24, lng: 31.33 },
  { name: "Katete", region: "Eastern", country: "ZM", lat: -14.05, lng: 32.05 },
  { name: "Kasama", region: "Northern", country: "ZM", lat: -10.2129, lng: 31.1808 },
  { name: "Mbala", region: "Northern", country: "ZM", lat: -8.84, lng: 31.37 },
  { name: "Mpika", region: "Muchinga", country: "ZM", lat: -11.83, lng: 31.45 },
  { name: "Chinsali", region: "Muchinga", country: "ZM", lat: -10.55, lng: 32.07 },
  { name: "Mansa", region: "Luapula", country: "ZM", lat: -11.2, lng: 28.89 },
  { name: "Samfya", region: "Luapula", country: "ZM", lat: -11.36, lng: 29.56 },
  { name: "Solwezi", region: "North-Western", country: "ZM", lat: -12.1688, lng: 26.3894 },
  { name: "Mongu", region: "Western", country: "ZM", lat: -15.2484, lng: 23.1274 },
  { name: "Senanga", region: "Western", country: "ZM", lat: -16.12, lng: 23.27 },
  { name: "Harare", region: "Harare", country: "ZW", lat: -17.8292, lng: 31.0522 },
  { name: "Lilongwe", region: "Central", country: "MW", lat: -13.9626, lng: 33.7741 },
  { name: "Gaborone", region: "South-East", country: "BW", lat: -24.6282, lng: 25.9231 },
  { name: "Dar es Salaam", region: "Dar es Salaam", country: "TZ", lat: -6.7924, lng: 39.2083 },
  { name: "Maputo", region: "Maputo", country: "MZ", lat: -25.9692, lng: 32.5732 },
];

export const DEFAULT_PLACE = PLACES[0] as Place;

function fold(s: string): string {
  return s.normalize("NFD").replace(/\p{Diacritic}/gu, "").toLowerCase().trim();
}

/** Places whose name starts with (then contains) the typed text, best first. */
export function findPlaces(text: string, limit = 8): Place[] {
  const t = fold(text);
  if (!t) return [];
  const starts = PLACES.filter((p) => fold(p.name).startsWith(t));
  const contains = PLACES.filter((p) => !starts.includes(p) && fold(p.name).includes(t));
  return [...starts, ...contains].slice(0, limit);
}

export function placeByName(name: string): Place | undefined {
  const t = fold(name);
  return PLACES.find((p) => fold(p.name) === t);
}
