/** The invented vendors of the demo network; `code` is the prefix of their SKUs and serial numbers. */
export const DEMO_VENDORS = [
  {
    code: 'LKS',
    serialPrefix: 'LK',
    name: 'Larkspur Energy Systems',
    rmaEmail: 'rma@larkspur-energy.test',
    defaultWarrantyMonths: 60,
    notes: 'Lithium house batteries, alternator chargers and monitors. Ships advance replacements.',
  },
  {
    code: 'NVB',
    serialPrefix: 'NV',
    name: 'Northvane Battery Co.',
    rmaEmail: 'warranty@northvane-battery.test',
    defaultWarrantyMonths: 36,
    notes: 'Heated lithium, AGM and starter batteries. Wants photos of the terminals with every claim.',
  },
  {
    code: 'TDW',
    serialPrefix: 'TW',
    name: 'Tidewell Power Electronics',
    rmaEmail: 'returns@tidewell-power.test',
    defaultWarrantyMonths: 24,
    notes: 'DC-DC chargers, solar controllers, inverters.',
  },
  {
    code: 'SNM',
    serialPrefix: 'SM',
    name: 'Sunmere Solar',
    rmaEmail: 'claims@sunmere-solar.test',
    defaultWarrantyMonths: 120,
    notes: 'Rigid and flexible panels; flexible panels carry a shorter warranty.',
  },
  {
    code: 'GRA',
    serialPrefix: 'GR',
    name: 'Gale Ridge Air',
    rmaEmail: 'service@galeridge-air.test',
    defaultWarrantyMonths: 24,
    notes: 'Onboard compressors, tanks and fittings.',
  },
  {
    code: 'WXW',
    serialPrefix: 'WX',
    name: 'Wexcombe Wire Works',
    rmaEmail: 'orders@wexcombe-wire.test',
    defaultWarrantyMonths: 12,
    notes: 'Cable, terminals, fuse holders, switch panels and battery trays.',
  },
] as const;

export type VendorCode = (typeof DEMO_VENDORS)[number]['code'];
