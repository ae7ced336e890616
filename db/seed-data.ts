// The invented demo scenario: small fish-farming businesses and newcomers around
// Lusaka, Central and Southern provinces of Zambia. Every business and person is
// made up; town coordinates are approximate town centres.

export type Town = { name: string; region: string; lat: number; lng: number };

export const TOWNS: Town[] = [
  { name: "Lusaka", region: "Lusaka", lat: -15.4167, lng: 28.2833 },
  { name: "Chongwe", region: "Lusaka", lat: -15.3292, lng: 28.682 },
  { name: "Kafue", region: "Lusaka", lat: -15.7691, lng: 28.1814 },
  { name: "Chilanga", region: "Lusaka", lat: -15.5594, lng: 28.2769 },
  { name: "Luangwa", region: "Lusaka", lat: -15.62, lng: 30.41 },
  { name: "Kabwe", region: "Central", lat: -14.4469, lng: 28.4464 },
  { name: "Chisamba", region: "Central", lat: -14.9833, lng: 28.3667 },
  { name: "Mumbwa", region: "Central", lat: -14.9783, lng: 27.0619 },
  { name: "Kapiri Mposhi", region: "Central", lat: -13.97, lng: 28.68 },
  { name: "Chibombo", region: "Central", lat: -14.66, lng: 28.08 },
  { name: "Mazabuka", region: "Southern", lat: -15.856, lng: 27.748 },
  { name: "Monze", region: "Southern", lat: -16.2803, lng: 27.4733 },
  { name: "Siavonga", region: "Southern", lat: -16.538, lng: 28.7087 },
  { name: "Choma", region: "Southern", lat: -16.8065, lng: 26.987 },
];

export const FIRST_NAMES = [
  "Mwila", "Chanda", "Bwalya", "Mulenga", "Nkandu", "Thandiwe", "Kasonde", "Mutale", "Namwinga", "Chileshe",
  "Lubasi", "Inonge", "Mwansa", "Kabwe", "Natasha", "Joseph", "Grace", "Peter", "Ruth", "Moses",
  "Esther", "Daniel", "Mercy", "Brian", "Precious", "Kelvin", "Memory", "Given", "Charity", "Elijah",
];
export const SURNAMES = [
  "Tembo", "Phiri", "Banda", "Zulu", "Mwanza", "Lungu", "Sakala", "Mbewe", "Chirwa", "Ngoma",
  "Musonda", "Kapasa", "Siame", "Hamoonga", "Mudenda", "Simwinga", "Nyirenda", "Chiluba", "Kalaba", "Moonga",
];

// Invented business names, none of them real.
export const HATCHERY_NAMES = [
  "Riverbend Fingerlings", "Green Reed Hatchery", "Clearwater Fry Co.", "Sunrise Fish Seed", "Hillside Hatch",
  "Blue Basin Fingerlings", "Twin Springs Hatchery", "Golden Fin Nursery", "Stillwater Seedstock", "Marula Fish Farm",
  "Papyrus Hatchery", "Kingfisher Fry House", "Acacia Fingerling Centre",
];
export const BUILDER_NAMES = [
  "Solid Ground Tanks", "Level Base Builders", "Bluewall Tank Works", "Frame & Liner Co.", "Deepwater Pond Diggers",
  "Steady Hands Construction", "True Square Tanks", "Watertight Builders", "Canvas Tank Makers", "Stonebank Concrete",
  "Open Field Earthworks", "Lakeline Tank Services", "Brightliner Fabrication", "Cornerstone Aqua Builds", "Riverside Masons",
  "Tarp & Timber Works", "Plain Level Ponds", "Homestead Tank Crew", "Keel Construction", "Northgate Tank Builders",
];
