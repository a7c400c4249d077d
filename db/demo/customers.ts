import { between, chance, type Random } from './draw.ts';
import { pick } from './random.ts';

/** Invented customers of the demo shops; the cities and area codes are real, the numbers 555-01xx are not. */
const FIRST = [
  'Abel', 'Bettina', 'Caspian', 'Delphine', 'Emmett', 'Flora', 'Gideon', 'Hazel', 'Ivo', 'Junia', 'Kit', 'Linnea',
  'Magnus', 'Nell', 'Otto', 'Pippa', 'Rafe', 'Saoirse', 'Teodor', 'Una', 'Vesna', 'Wilder', 'Xavi', 'Zadie',
  'Arlo', 'Birdie', 'Cormac', 'Dagny', 'Ezra', 'Fern', 'Gus', 'Honor',
] as const;
const LAST = [
  'Abernethy', 'Blackwood', 'Castellane', 'Drummond', 'Eastley', 'Featherstone', 'Gosling', 'Holloway', 'Inchbald',
  'Juniper', 'Kilbride', 'Larkin', 'Mowbray', 'Nettleford', 'Ormsby', 'Pemberton', 'Quennell', 'Radcliffe', 'Sallow',
  'Tregarthen', 'Upshaw', 'Vellacott', 'Wainwright', 'Yeoman', 'Ashgrove', 'Brightwater', 'Coldridge', 'Dalgleish',
] as const;
const BUSINESS_NAMES = ['Pinecrest', 'Hollow Oak', 'Redfern', 'Bluestem', 'Talus', 'Copper Kettle', 'Saltgrass', 'Larchmont'] as const;
const BUSINESS_TRADES = ['Mobile Vet', 'Surveying', 'Field Services', 'Catering', 'Trail Crew', 'Tree Care', 'Outfitters', 'Film Unit'] as const;
const STREETS = [
  'Juniper Hollow Rd', 'Quarry Bend Ln', 'Old Mill Ct', 'Switchback Dr', 'Aspen Terrace', 'Cinder Flat Rd',
  'Heron Point Way', 'Granary St', 'Kettle Pond Ln', 'Sawtooth Ave', 'Lantern Hill Rd', 'Windrow Ct',
] as const;
const MAIL_DOMAINS = ['postbox.test', 'fernmail.test', 'quillnet.test', 'harbormail.test'] as const;

/** Where a shop is, for its customers' addresses and phone numbers; a Canadian area's prefix is a postal district (e.g. T2P). */
export interface Area {
  state: string;
  areaCode: string;
  zipPrefix: string;
  country?: 'CA';
  /** The city customers give, when it is not simply the shop's name. */
  city?: string;
}

/** The demo shops' areas, by location code. */
export const DEMO_AREAS: Record<string, Area> = {
  DEN: { state: 'CO', areaCode: '303', zipPrefix: '802' },
  BOI: { state: 'ID', areaCode: '208', zipPrefix: '837' },
  PDX: { state: 'OR', areaCode: '503', zipPrefix: '972' },
  PHX: { state: 'AZ', areaCode: '602', zipPrefix: '850' },
  AUS: { state: 'TX', areaCode: '512', zipPrefix: '787' },
  DLH: { state: 'MN', areaCode: '218', zipPrefix: '558' },
  AVL: { state: 'NC', areaCode: '828', zipPrefix: '288' },
  BTV: { state: 'VT', areaCode: '802', zipPrefix: '054' },
};

export interface DemoCustomer {
  name: string;
  email: string;
  phone: string;
  addressLine1: string;
  addressLine2: string;
  city: string;
  region: string;
  postalCode: string;
  notes: string;
}

const slug = (text: string) => text.toLowerCase().replace(/[^a-z0-9]+/g, '.').replace(/^\.|\.$/g, '');

const postalCode = (random: Random, area: Area) =>
  area.country === 'CA'
    ? `${area.zipPrefix} ${between(random, 1, 9)}${pick(random, [...'ABCEGHJKLMNPRSTVWXYZ'])}${between(random, 0, 9)}`
    : `${area.zipPrefix}${String(between(random, 1, 99)).padStart(2, '0')}`;

/** A new customer of the shop in `city`; some leave no e-mail, phone or address. */
export function newCustomer(random: Random, area: Area, city: string): DemoCustomer {
  const business = chance(random, 0.08);
  const name = business ? `${pick(random, BUSINESS_NAMES)} ${pick(random, BUSINESS_TRADES)}` : `${pick(random, FIRST)} ${pick(random, LAST)}`;
  const email = business ? `office@${slug(name).replace(/\./g, '-')}.test` : `${slug(name)}${between(random, 1, 99)}@${pick(random, MAIL_DOMAINS)}`;
  const hasAddress = chance(random, 0.5);
  return {
    name,
    email: chance(random, 0.7) ? email : '',
    phone: chance(random, 0.8) ? `(${area.areaCode}) 555-01${String(between(random, 0, 99)).padStart(2, '0')}` : '',
    addressLine1: hasAddress ? `${between(random, 12, 9890)} ${pick(random, STREETS)}` : '',
    addressLine2: hasAddress && chance(random, 0.1) ? `Unit ${between(random, 1, 40)}` : '',
    city: hasAddress ? city : '',
    region: hasAddress ? area.state : '',
    postalCode: hasAddress ? postalCode(random, area) : '',
    notes: business ? 'Fleet account: invoice monthly.' : '',
  };
}
