import type { DemoFirm, DemoStep } from './demo-context';

/*
 * Demo customers, contacts and sites. Every firm, person, street and town is invented;
 * postcodes follow the UK shape with made-up areas (WX around Wexbridge, OS around Old
 * Sarnley); e-mail domains are under .test (RFC 2606).
 */

/** A business: name, what it does (for its sites' names), and how many sites it has. */
type Business = [name: string, trade: string, sites: number];

const KESTREL_BUSINESSES: Business[] = [
  ['Greyling Motors', 'Workshop', 2],
  ['Quillford Auto Repairs', 'Workshop', 1],
  ['Ambrey Tyre & Exhaust', 'Fitting bay', 2],
  ['Fallowmere Classic Cars', 'Showroom', 2],
  ['Hollinby Fitness Barn', 'Gym floor', 1],
  ['Tannerford Joinery', 'Machine shop', 1],
  ['Rushmoss Cabinet Makers', 'Workshop', 2],
  ['Sedgecombe Bakery', 'Bakehouse', 2],
  ['Thistleby Community School', 'Sports hall', 3],
  ['Kiln Lane Storage', 'Warehouse', 3],
  ['Sallowfield Distribution', 'Warehouse', 4],
  ['Pellow Freight', 'Loading bay', 2],
  ['Brack & Sons Agricultural Engineers', 'Workshop', 2],
  ['Wexbridge Motorcycle Centre', 'Showroom', 1],
  ['Oriel Dance Studio', 'Studio', 1],
  ['Copperbeck Brewery', 'Brewhouse', 2],
  ['Merrowvale Veterinary Practice', 'Kennels', 1],
  ['Ferrow Valley Fire & Rescue Trust', 'Appliance bay', 2],
  ['Gantry Print Works', 'Press hall', 1],
  ['Lindqvist Camper Conversions', 'Workshop', 2],
  ['Hatherwick Self Store', 'Warehouse', 2],
  ['Dunnockfield Plant Hire', 'Yard workshop', 1],
  ['Alderspinney Cricket Club', 'Pavilion', 1],
  ['Wexbridge Kart Track', 'Pit garage', 2],
  ['Saffery Cycle Works', 'Shop floor', 1],
  ['Tollgate Electrical Wholesale', 'Trade counter', 2],
];

const KESTREL_HOMEOWNERS = [
  'Hana Vickery',
  'Tomasz and Ella Brandt',
  'Oluwaseun Adeyemi-Price',
  'Margaret Pennywhistle',
  'Ravi and Sunita Okafor-Lal',
  'Declan Moorcroft',
  'Ingrid Salvesen',
  'Bartholomew Kettle',
  'Priya Naidoo',
  'Gethin Rowlands',
  'Annika Holm',
  'Felix and Marguerite Castellane',
  'Orla Fitzwarren',
  'Callum Dray',
];

const KESTREL_TOWNS: [town: string, area: string][] = [
  ['Wexbridge', 'WX1'],
  ['Wexbridge', 'WX3'],
  ['Hollinby', 'WX5'],
  ['Sedgecombe', 'WX6'],
  ['Ambrey', 'WX7'],
  ['Fallowmere', 'WX8'],
  ['Quillford', 'WX9'],
  ['Rushmoss', 'WX11'],
];

const PENNICK_BUSINESSES: Business[] = [
  ['Sarnley Quay Boatyard', 'Boat shed', 2],
  ['Gullsby Garage', 'Workshop', 1],
  ['Old Sarnley Leisure Centre', 'Fitness suite', 1],
];
const PENNICK_HOMEOWNERS = ['Wilhelmina Tregear', 'Jory and Kenver Pascoe'];
const PENNICK_TOWNS: [string, string][] = [
  ['Old Sarnley', 'OS7'],
  ['Gullsby', 'OS3'],
  ['Sarnley Quay', 'OS9'],
];

const STREETS = [
  'Forge Street',
  'Linnet Close',
  'Tannery Yard',
  'Mill Race Road',
  'Cooper’s Row',
  'Station Approach',
  'Kestrel Way',
  'Barley Lane',
  'Heron Business Park',
  'Orchard Rise',
  'Canal Wharf',
  'Beacon Road',
];
const FLOORS = [
  'Power-floated concrete',
  'Sand-cement screed',
  'Old quarry tiles',
  'Painted concrete, flaking',
  'Asphalt',
  'Timber boards over joists',
];
const ACCESS = [
  'Roller door 4 m wide; key from the office.',
  'Side gate, code from the contact on the day.',
  'Ring ahead: alarm is set until 7:30.',
  'Access through the shop; keep the fire exit clear.',
  '',
];
const PARKING = ['Yard, room for a van and trailer', 'Street only', 'Drive', 'Visitor bays'];
const HOURS = ['Mon–Fri 8:00–17:30', 'Mon–Sat 7:00–18:00', '24 hours', 'Term time 8:00–16:00'];
const ROLES = ['Owner', 'Manager', 'Facilities', 'Accounts', 'Site supervisor'];
const FIRST = ['Alys', 'Bram', 'Cerys', 'Dominic', 'Esme', 'Fintan', 'Greta', 'Hamish', 'Isla'];
const LAST = ['Ashdown', 'Birtwhistle', 'Corrigan', 'Delahaye', 'Eastmond', 'Fairweather'];

const slug = (s: string) =>
  s
    .toLowerCase()
    .replace(/&/g, 'and')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '');

/** A street address and an invented postcode in one of the firm's towns. */
function address(firm: DemoFirm, towns: [string, string][]) {
  const pick = <T>(list: readonly T[]) => list[Math.floor(firm.random() * list.length)];
  const [town, area] = pick(towns);
  const letters = 'ABDEFGHJLNPQRSTUWXYZ';
  const unit = 1 + Math.floor(firm.random() * 60);
  const postcode = `${area} ${1 + Math.floor(firm.random() * 9)}${pick([...letters])}${pick([...letters])}`;
  return { lines: [`${unit} ${pick(STREETS)}`, town], postcode };
}

/** A day in the 18 months before the demo's today. */
function someDayBefore(firm: DemoFirm): Date {
  return new Date(firm.today.getTime() - Math.floor(firm.random() * 548) * 86_400_000);
}

async function addCustomer(
  firm: DemoFirm,
  towns: [string, string][],
  c: { kind: 'business' | 'homeowner'; name: string; ref: string | null; sites: string[] },
) {
  const pick = <T>(list: readonly T[]) => list[Math.floor(firm.random() * list.length)];
  const billing = address(firm, towns);
  const business = c.kind === 'business';
  const domain = business ? `${slug(c.name)}.test` : 'homemail.test';
  const created = await firm.tx
    .insertInto('customer')
    .values({
      tenantId: firm.tenantId,
      kind: c.kind,
      name: c.name,
      externalRef: c.ref,
      email: business ? `office@${domain}` : `${slug(c.name)}@${domain}`,
      phone: `01632 ${String(960000 + Math.floor(firm.random() * 999)).padStart(6, '0')}`,
      billingAddressLines: billing.lines,
      postcode: billing.postcode,
      paymentTermsDays: business && firm.random() < 0.3 ? pick([7, 14, 45, 60]) : null,
      // Integer pence: £1,000 to £15,000 in whole pounds for businesses with an account.
      creditLimitMinor: business && c.ref ? (1 + Math.floor(firm.random() * 15)) * 100_000 : null,
      notes: business && firm.random() < 0.4 ? 'Prefers work booked outside opening hours.' : '',
      createdAt: someDayBefore(firm),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const contacts = business ? 1 + Math.floor(firm.random() * 2) : 1;
  for (let i = 0; i < contacts; i++) {
    const words = c.name.split(' ');
    const name = business ? `${pick(FIRST)} ${pick(LAST)}` : `${words[0]} ${words.at(-1)}`;
    await firm.tx
      .insertInto('customerContact')
      .values({
        tenantId: firm.tenantId,
        customerId: created.id,
        name,
        role: business ? pick(ROLES) : 'Homeowner',
        email: `${slug(name)}@${domain}`,
        phone: `07700 ${String(900000 + Math.floor(firm.random() * 999)).padStart(6, '0')}`,
        position: i,
      })
      .execute();
  }
  for (const [i, siteName] of c.sites.entries()) {
    // A business's first site is at its billing address; homes are the billing address.
    const at = i === 0 ? billing : address(firm, towns);
    await firm.tx
      .insertInto('site')
      .values({
        tenantId: firm.tenantId,
        customerId: created.id,
        name: siteName,
        addressLines: at.lines,
        postcode: at.postcode,
        accessNotes: pick(ACCESS),
        parking: pick(PARKING),
        floorType: pick(FLOORS),
        openingHours: business ? pick(HOURS) : '',
      })
      .execute();
  }
}

/** Adds the firm's customers; the bulk goes to the Kestrel demo firm. */
export const customersDemo: DemoStep = async (firm) => {
  const kestrel = firm.slug === 'kestrel-floorworks';
  const towns = kestrel ? KESTREL_TOWNS : PENNICK_TOWNS;
  const businesses = kestrel ? KESTREL_BUSINESSES : PENNICK_BUSINESSES;
  const homeowners = kestrel ? KESTREL_HOMEOWNERS : PENNICK_HOMEOWNERS;
  const prefix = kestrel ? 'K' : 'P';
  let sites = 0;
  for (const [i, [name, trade, count]] of businesses.entries()) {
    const names = Array.from({ length: count }, (_, n) => (n === 0 ? trade : `${trade} ${n + 1}`));
    // Most businesses came with an account number from the firm's previous records.
    const ref = firm.random() < 0.8 ? `${prefix}-C${String(i + 1).padStart(4, '0')}` : null;
    await addCustomer(firm, towns, { kind: 'business', name, ref, sites: names });
    sites += count;
  }
  for (const name of homeowners) {
    const names = firm.random() < 0.2 ? ['Home garage', 'Garden room'] : ['Home garage'];
    await addCustomer(firm, towns, { kind: 'homeowner', name, ref: null, sites: names });
    sites += names.length;
  }
  const customers = businesses.length + homeowners.length;
  return `${customers} customers (${businesses.length} businesses), ${sites} sites`;
};
