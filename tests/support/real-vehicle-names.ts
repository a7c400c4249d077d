/**
 * Words from real vehicle makes, models and trims, and the load and wheelbase numbers they carry,
 * that demo vehicles must never use (DESIGN.md, "Names"). Lower case, one word each.
 */
export const REAL_VEHICLE_WORDS = new Set([
  // makes
  'ford', 'chevrolet', 'chevy', 'gmc', 'ram', 'dodge', 'jeep', 'toyota', 'nissan', 'honda', 'subaru', 'mercedes', 'benz',
  'freightliner', 'volkswagen', 'vw', 'isuzu', 'hino', 'fuso', 'mitsubishi', 'land', 'rover', 'hyundai', 'kia', 'mazda',
  'lexus', 'infiniti', 'rivian', 'tesla', 'lincoln', 'cadillac', 'buick', 'international', 'peterbilt', 'kenworth', 'mack',
  'volvo', 'iveco', 'fiat', 'renault', 'peugeot', 'citroen', 'opel', 'vauxhall', 'suzuki', 'hummer', 'scout',
  // models
  'sprinter', 'transit', 'promaster', 'econoline', 'express', 'savana', 'metris', 'crafter', 'ducato', 'daily', 'hiace',
  'tacoma', 'tundra', '4runner', 'sequoia', 'highlander', 'hilux', 'wrangler', 'gladiator', 'cherokee', 'wagoneer',
  'compass', 'silverado', 'colorado', 'canyon', 'sierra', 'tahoe', 'suburban', 'yukon', 'ranger', 'maverick', 'bronco',
  'explorer', 'expedition', 'frontier', 'titan', 'xterra', 'pathfinder', 'armada', 'ridgeline', 'pilot', 'passport',
  'outback', 'forester', 'ascent', 'defender', 'discovery', 'durango', 'amarok', 'navara', 'santa', 'cruz', 'odyssey',
  'sienna', 'caravan', 'pacifica', 'nv', 'nv200', 'e350', 'f150', 'f250', 'f350', 'f450', 'f550', 'hd', 'shd',
  // trims
  'laramie', 'lariat', 'rebel', 'raptor', 'tremor', 'rubicon', 'sahara', 'badlands', 'wildtrak', 'denali', 'at4', 'z71',
  'trd', 'sr5', 'xlt', 'ltz', 'tradesman', 'limited', 'platinum', 'overland', 'trailhawk', 'timberline', 'wilderness',
]);

/** Load ratings and wheelbases in inches that real vans and pickups are named by. */
export const REAL_VEHICLE_NUMBER = /\d{3,4}|f-?\d{2,3}/i;

/** The real words and numbers in a vehicle's name. */
export function realNamesIn(name: string): string[] {
  const words = name.toLowerCase().split(/[^a-z0-9]+/).filter((w) => REAL_VEHICLE_WORDS.has(w));
  const number = REAL_VEHICLE_NUMBER.exec(name)?.[0];
  return number ? [...words, number] : words;
}
