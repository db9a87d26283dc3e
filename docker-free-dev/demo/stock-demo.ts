import { postMovements, type MovementRequest } from '@latchwork/stock-server';
import type { DemoFirm, DemoStep } from './demo-context';

/**
 * The demo catalogue: an invented range ("Keystep" interlocking PVC tiles and their trims,
 * "Duobond" two-part adhesive, and the sundries a fit needs) from invented suppliers, stocked
 * in a warehouse and two vans with batches received over the last months — some adhesive
 * close to expiry, one batch already expired — and issues to the firm's jobs, so the stock,
 * value and expiry pages have something to show. Kestrel gets the whole range; Pennick a
 * small one.
 */

const SUPPLIERS = [
  {
    key: 'poly',
    name: 'Harrowgate Polymers Ltd',
    email: 'orders@harrowgate-polymers.test',
    leadTimeDays: 10,
    orderCostMinor: 2500,
  },
  {
    key: 'glue',
    name: 'Wexcombe Adhesives',
    email: 'sales@wexcombe-adhesives.test',
    leadTimeDays: 5,
    orderCostMinor: 1800,
  },
  {
    key: 'hire',
    name: 'Tollbar Tool Hire',
    email: 'desk@tollbar-hire.test',
    leadTimeDays: 1,
    orderCostMinor: 0,
  },
] as const;

type SupplierKey = (typeof SUPPLIERS)[number]['key'];

interface DemoProduct {
  sku: string;
  name: string;
  kind: string;
  supplier: SupplierKey | null;
  attributes: Record<string, string | number>;
  unit: [string, string];
  pack: [string, string, number];
  cost: number;
  price: number;
  shelfLifeDays?: number;
  /** Boxes (packs) received per batch; 0 for what is not stocked (labour, hire). */
  receive: number;
}

/**
 * The range, one product a line: sku | name | kind | supplier | unit/units | pack/packs/size |
 * cost | price (minor units) | shelf life days | packs received per batch | attributes.
 */
const RANGE_TABLE = `
KS-7-GRA|Keystep 7 mm interlocking tile, Graphite|tile|poly|tile/tiles|box/boxes/20|298|492||12|colour=Graphite;thicknessMm=7;finish=coin top;pitchMm=500
KS-7-SLB|Keystep 7 mm interlocking tile, Slate Blue|tile|poly|tile/tiles|box/boxes/20|298|492||12|colour=Slate Blue;thicknessMm=7;finish=coin top;pitchMm=500
KS-7-AMB|Keystep 7 mm interlocking tile, Amber|tile|poly|tile/tiles|box/boxes/20|312|515||12|colour=Amber;thicknessMm=7;finish=coin top;pitchMm=500
KS-7-RED|Keystep 7 mm interlocking tile, Signal Red|tile|poly|tile/tiles|box/boxes/20|312|515||12|colour=Signal Red;thicknessMm=7;finish=coin top;pitchMm=500
KS-5-GRA|Keystep 5 mm interlocking tile, Graphite|tile|poly|tile/tiles|box/boxes/24|214|353||12|colour=Graphite;thicknessMm=5;finish=diamond plate;pitchMm=500
KS-5-PEB|Keystep 5 mm interlocking tile, Pebble Grey|tile|poly|tile/tiles|box/boxes/24|214|353||12|colour=Pebble Grey;thicknessMm=5;finish=diamond plate;pitchMm=500
KS-RAMP-7|Keystep edge ramp, 7 mm, Graphite|ramp|poly|ramp/ramps|box/boxes/10|265|450||4|colour=Graphite;thicknessMm=7;lengthMm=500
KS-CORN-7|Keystep outside corner, 7 mm, Graphite|corner_piece|poly|corner/corners|box/boxes/4|310|540||3|colour=Graphite;thicknessMm=7
KS-SKIRT-2500|Keystep flexible skirting, 2.5 m length|skirting|poly|length/lengths|box/boxes/10|720|1150||3|colour=Graphite;lengthMm=2500
KS-TRIM-2500|Keystep corner trim, 2.5 m length|corner_trim|poly|length/lengths|box/boxes/10|480|790||2|colour=Graphite;lengthMm=2500
DB-2K-KIT|Duobond 2K floor adhesive kit (resin + hardener)|adhesive|glue|kit/kits|box/boxes/4|4300|6900|180|5|coverageMm2=12000000
GS-PRIME-5L|Graspline acrylic primer, 5 litre|primer|glue|tub/tubs|box/boxes/2|2450|3900|365|4|coverageMm2=40000000
LM-FILL-20|Levelmend repair filler, 20 kg bag|filler|glue|bag/bags|pallet/pallets/40|1890|2990|270|1|coverageMm2=4000000
HF-TAPE-25|Holdfast double-sided tape, 25 m roll|tape|glue|roll/rolls|box/boxes/6|1150|1850||3|lengthMm=25000
ST-MASTIC-310|Seamtack anchoring mastic, 310 ml|mastic|glue|cartridge/cartridges|box/boxes/12|560|950|540|2|colour=Grey
TB-GUILL-DAY|Guillotine tile cutter hire, per day|hire_tool|hire|day/days|day/days/1|2800|4500||0|
LAB-FIT-HR|Fitting labour, per hour|labour||hour/hours|hour/hours/1|2200|4200||0|`;

function parseRange(table: string): DemoProduct[] {
  return table
    .trim()
    .split('\n')
    .map((line) => {
      const [sku, name, kind, supplier, unit, pack, cost, price, life, receive, attrs] =
        line.split('|');
      const [packOne, packOther, size] = pack.split('/');
      const attributes = Object.fromEntries(
        attrs
          .split(';')
          .filter(Boolean)
          .map((kv) => kv.split('='))
          .map(([k, v]) => [k, /^\d+$/.test(v) ? Number(v) : v]),
      );
      return {
        sku,
        name,
        kind,
        supplier: (supplier || null) as SupplierKey | null,
        attributes,
        unit: unit.split('/') as [string, string],
        pack: [packOne, packOther, Number(size)],
        cost: Number(cost),
        price: Number(price),
        shelfLifeDays: life ? Number(life) : undefined,
        receive: Number(receive),
      };
    });
}

const RANGE = parseRange(RANGE_TABLE);

const day = (today: Date, offset: number) => {
  const d = new Date(today);
  d.setUTCDate(d.getUTCDate() + offset);
  return d.toISOString().slice(0, 10);
};

async function addCatalogue(firm: DemoFirm, range: DemoProduct[]) {
  const { tx, tenantId } = firm;
  const supplierIds = new Map<string, string>();
  for (const s of SUPPLIERS) {
    const { key: _k, ...values } = s;
    const row = await tx
      .insertInto('supplier')
      .values({
        tenantId,
        ...values,
        contacts: JSON.stringify([{ name: 'Order desk', email: s.email }]),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    supplierIds.set(s.key, row.id);
  }
  const products = [];
  for (const p of range) {
    const row = await tx
      .insertInto('product')
      .values({
        tenantId,
        sku: p.sku,
        name: p.name,
        kind: p.kind as never,
        attributes: JSON.stringify(p.attributes),
        kitComponents: '[]',
        unitOne: p.unit[0],
        unitOther: p.unit[1],
        packOne: p.pack[0],
        packOther: p.pack[1],
        packSize: p.pack[2],
        costMinor: p.cost,
        priceMinor: p.price,
        preferredSupplierId: p.supplier ? supplierIds.get(p.supplier) : null,
        shelfLifeDays: p.shelfLifeDays ?? null,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    products.push({ ...p, id: row.id });
  }
  return products;
}

async function addLocations(firm: DemoFirm) {
  const names = [
    ['Tannery Yard warehouse', 'warehouse'],
    ['Van 1 (WX19 KFL)', 'van'],
    ['Van 2 (WX21 KFL)', 'van'],
  ] as const;
  const ids: string[] = [];
  for (const [name, kind] of names) {
    const row = await firm.tx
      .insertInto('stockLocation')
      .values({ tenantId: firm.tenantId, name, kind })
      .returning('id')
      .executeTakeFirstOrThrow();
    ids.push(row.id);
  }
  return ids;
}

export const stockDemo: DemoStep = async (firm) => {
  const bulk = firm.slug === 'kestrel-floorworks';
  const range = bulk
    ? RANGE
    : RANGE.filter((p) => ['KS-7-GRA', 'DB-2K-KIT', 'HF-TAPE-25'].includes(p.sku));
  const products = await addCatalogue(firm, range);
  const [warehouse, van1, van2] = await addLocations(firm);
  const owner =
    [...firm.members.entries()].find(([email]) => email.startsWith('owner@'))?.[1] ?? null;
  const actor = { userId: owner ?? '', role: 'owner' as const };
  const jobs = await firm.tx
    .selectFrom('job')
    .select('id')
    .where('tenantId', '=', firm.tenantId)
    .orderBy('number')
    .limit(8)
    .execute();
  let movements = 0;
  const post = async (m: MovementRequest[]) => {
    movements += (await postMovements(firm.tx, firm, actor, m, { today: day(firm.today, 0) }))
      .length;
  };
  for (const p of products.filter((x) => x.receive > 0)) {
    // Two batches of each: an older one and a recent one (tiles differ in shade by batch).
    for (const [n, age] of [
      [1, 150],
      [2, 40],
    ] as const) {
      const expiresIn = p.shelfLifeDays
        ? p.kind === 'adhesive' && n === 1
          ? -5
          : p.kind === 'adhesive'
            ? 20
            : p.shelfLifeDays - age
        : null;
      const batch = await firm.tx
        .insertInto('stockBatch')
        .values({
          tenantId: firm.tenantId,
          productId: p.id,
          code: `${p.sku.split('-').slice(-1)[0]}-${day(firm.today, -age).replaceAll('-', '').slice(2)}-${n}`,
          receivedOn: day(firm.today, -age),
          expiresOn: expiresIn === null ? null : day(firm.today, expiresIn),
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      const quantity = p.receive * p.pack[2];
      const cost = p.cost + (n === 2 ? Math.round(p.cost * 0.04) : 0);
      await post([
        {
          kind: 'receipt',
          productId: p.id,
          batchId: batch.id,
          toLocationId: warehouse,
          quantity,
          unitCostMinor: cost,
          at: new Date(`${day(firm.today, -age)}T08:30:00Z`),
        },
      ]);
      const toVan = Math.floor(quantity * (0.1 + firm.random() * 0.15));
      // Expired stock stays on the shelf until it is written off.
      if (toVan > 0 && (expiresIn === null || expiresIn >= 0))
        await post([
          {
            kind: 'transfer',
            productId: p.id,
            batchId: batch.id,
            fromLocationId: warehouse,
            toLocationId: n === 1 ? van1 : van2,
            quantity: toVan,
            at: new Date(`${day(firm.today, -age + 2)}T07:45:00Z`),
          },
        ]);
      // The older batch has fed a few jobs since it came in.
      if (n === 1 && jobs.length > 0 && p.kind !== 'adhesive') {
        const job = jobs[Math.floor(firm.random() * jobs.length)];
        const issued = Math.floor(quantity * (0.2 + firm.random() * 0.3));
        if (issued > 0)
          await post([
            {
              kind: 'issue',
              productId: p.id,
              batchId: batch.id,
              fromLocationId: warehouse,
              quantity: issued,
              jobId: job.id,
              at: new Date(`${day(firm.today, -age + 20)}T07:30:00Z`),
            },
          ]);
      }
    }
  }
  const tile = products.find((p) => p.kind === 'tile');
  if (tile && bulk) {
    const batch = await firm.tx
      .selectFrom('stockBatch')
      .select('id')
      .where('productId', '=', tile.id)
      .orderBy('receivedOn')
      .executeTakeFirstOrThrow();
    await post([
      {
        kind: 'write_off',
        productId: tile.id,
        batchId: batch.id,
        fromLocationId: warehouse,
        quantity: 3,
        writeOffReason: 'damaged',
        note: 'crushed corner of a box on the forklift',
        at: new Date(`${day(firm.today, -30)}T16:00:00Z`),
      },
    ]);
  }
  return `${products.length} products, ${SUPPLIERS.length} suppliers, 3 locations, ${movements} stock movements`;
};
