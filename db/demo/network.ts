/**
 * The invented demo franchise: Kestrel Auxiliary Power, two regions, eight shops in five time zones.
 * Every company and person here is made up; the cities are real.
 */
export const DEMO_COMPANY = 'Kestrel Auxiliary Power';

export const DEMO_REGIONS = [
  { code: 'WEST', name: 'Mountain and Pacific' },
  { code: 'EAST', name: 'Central and Eastern' },
] as const;

export const DEMO_LOCATIONS = [
  { region: 'WEST', code: 'DEN', name: 'Denver', timeZone: 'America/Denver', laborRateCents: 14500, royaltyBasisPoints: 600 },
  { region: 'WEST', code: 'BOI', name: 'Boise', timeZone: 'America/Boise', laborRateCents: 12500, royaltyBasisPoints: 600 },
  { region: 'WEST', code: 'PDX', name: 'Portland', timeZone: 'America/Los_Angeles', laborRateCents: 15500, royaltyBasisPoints: 650 },
  { region: 'WEST', code: 'PHX', name: 'Phoenix', timeZone: 'America/Phoenix', laborRateCents: 13500, royaltyBasisPoints: 600 },
  { region: 'EAST', code: 'AUS', name: 'Austin', timeZone: 'America/Chicago', laborRateCents: 13000, royaltyBasisPoints: 600 },
  { region: 'EAST', code: 'DLH', name: 'Duluth', timeZone: 'America/Chicago', laborRateCents: 11500, royaltyBasisPoints: 550 },
  { region: 'EAST', code: 'AVL', name: 'Asheville', timeZone: 'America/New_York', laborRateCents: 12500, royaltyBasisPoints: 600 },
  { region: 'EAST', code: 'BTV', name: 'Burlington', timeZone: 'America/New_York', laborRateCents: 13500, royaltyBasisPoints: 650 },
] as const;

export const FIRST_NAMES = [
  'Ada', 'Bram', 'Cleo', 'Dario', 'Edda', 'Fenn', 'Greta', 'Hollis', 'Ines', 'Jory', 'Kaia', 'Lowell',
  'Mara', 'Nils', 'Oona', 'Pax', 'Quinn', 'Rhea', 'Soren', 'Tamsin', 'Ulla', 'Vance', 'Wren', 'Yara',
] as const;

export const LAST_NAMES = [
  'Ashdown', 'Birchall', 'Calloway', 'Dunmore', 'Ellery', 'Fairweather', 'Garrow', 'Hathaway', 'Ingram',
  'Jessop', 'Kettering', 'Lockhart', 'Merriman', 'Northcott', 'Oakes', 'Pennington', 'Quarles', 'Rudd',
  'Stroud', 'Thistle', 'Underhill', 'Voss', 'Whitlock', 'Yardley',
] as const;

/** The sign-ins the README lists, and where each one works. */
export const DEMO_SIGN_INS = [
  { email: 'owner@demo.busbar.test', name: 'Marguerite Okafor', role: 'owner' },
  { email: 'regional@demo.busbar.test', name: 'Tobias Renwick', role: 'regional_manager', region: 'WEST' },
  { email: 'regional2@demo.busbar.test', name: 'Odile Fairbank', role: 'regional_manager', region: 'EAST' },
  { email: 'lead@demo.busbar.test', name: 'Priya Halvorsen', role: 'location_lead', location: 'DEN' },
  { email: 'tech@demo.busbar.test', name: 'Dmitri Castellanos', role: 'technician', location: 'DEN' },
  { email: 'warranty@demo.busbar.test', name: 'Ingrid Salazar', role: 'warranty_clerk', location: 'DEN' },
  { email: 'accountant@demo.busbar.test', name: 'Felix Moreau', role: 'accountant' },
  { email: 'lead2@demo.busbar.test', name: 'Rosalind Achebe', role: 'location_lead', location: 'AVL' },
] as const;
