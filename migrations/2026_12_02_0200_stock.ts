import { sql, type Kysely } from 'kysely';

/**
 * The catalogue (products, suppliers), stock locations and batches, the append-only stock
 * ledger with its balance summary and weighted-average cost state, reservations per job and
 * the firm's stock settings. Quantities are integer steps of the product's stock unit
 * (`decimals` 0 for tiles, boxes, kits), money is integer minor units: both `bigint`.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table supplier (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      name text not null check (length(name) between 1 and 200),
      email citext,
      phone text,
      account_ref text,
      address_lines text[] not null default '{}',
      contacts jsonb not null default '[]' check (jsonb_typeof(contacts) = 'array'),
      lead_time_days integer not null default 7 check (lead_time_days between 0 and 365),
      order_cost_minor bigint check (order_cost_minor >= 0),
      notes text not null default '',
      active boolean not null default true,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (tenant_id, id)
    )`.execute(db);
  await sql`create unique index supplier_name_idx on supplier (tenant_id, lower(name))`.execute(db);

  await sql`
    create table product (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      sku text not null check (length(sku) between 1 and 60),
      name text not null check (length(name) between 1 and 200),
      kind text not null check (kind in ('tile', 'ramp', 'corner_piece', 'skirting',
        'corner_trim', 'adhesive', 'hardener', 'primer', 'filler', 'tape', 'mastic',
        'hire_tool', 'labour', 'other')),
      attributes jsonb not null default '{}' check (jsonb_typeof(attributes) = 'object'),
      unit_one text not null default 'unit',
      unit_other text not null default 'units',
      decimals smallint not null default 0 check (decimals between 0 and 3),
      pack_one text not null default 'pack',
      pack_other text not null default 'packs',
      pack_size bigint not null default 1 check (pack_size >= 1),
      kit_components jsonb not null default '[]' check (jsonb_typeof(kit_components) = 'array'),
      cost_minor bigint not null default 0 check (cost_minor >= 0),
      price_minor bigint not null default 0 check (price_minor >= 0),
      tax_rate_bp integer not null default 2000 check (tax_rate_bp between 0 and 10000),
      preferred_supplier_id uuid,
      service_level_bp integer check (service_level_bp between 5000 and 9999),
      lead_time_days integer check (lead_time_days between 0 and 365),
      min_order_quantity bigint check (min_order_quantity > 0),
      round_to_packs boolean not null default true,
      shelf_life_days integer check (shelf_life_days > 0),
      active boolean not null default true,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (tenant_id, id),
      unique (tenant_id, sku),
      foreign key (tenant_id, preferred_supplier_id) references supplier (tenant_id, id)
    )`.execute(db);
  await sql`create index product_kind_idx on product (tenant_id, kind, lower(name))`.execute(db);
  await sql`create index product_search_idx on product
    using gin ((sku || ' ' || name) gin_trgm_ops)`.execute(db);

  await sql`
    create table stock_location (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      name text not null check (length(name) between 1 and 120),
      kind text not null check (kind in ('warehouse', 'van', 'site')),
      job_id uuid,
      site_id uuid,
      notes text not null default '',
      active boolean not null default true,
      created_at timestamptz not null default now(),
      unique (tenant_id, id),
      foreign key (tenant_id, job_id) references job (tenant_id, id),
      foreign key (tenant_id, site_id) references site (tenant_id, id),
      check (kind = 'site' or (job_id is null and site_id is null))
    )`.execute(db);
  await sql`create unique index stock_location_name_idx on stock_location (tenant_id, lower(name))`.execute(
    db,
  );

  await sql`
    create table stock_batch (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      product_id uuid not null,
      code text not null check (length(code) between 1 and 60),
      received_on date not null,
      expires_on date check (expires_on >= received_on),
      supplier_id uuid,
      created_at timestamptz not null default now(),
      unique (tenant_id, id),
      unique (tenant_id, product_id, code),
      foreign key (tenant_id, product_id) references product (tenant_id, id),
      foreign key (tenant_id, supplier_id) references supplier (tenant_id, id)
    )`.execute(db);
  await sql`create index stock_batch_expiry_idx on stock_batch (tenant_id, expires_on)
    where expires_on is not null`.execute(db);

  await sql`
    create table reservation (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      job_id uuid not null,
      product_id uuid not null,
      batch_id uuid,
      location_id uuid,
      quantity bigint not null check (quantity > 0),
      issued_quantity bigint not null default 0 check (issued_quantity >= 0),
      status text not null default 'active' check (status in ('active', 'fulfilled', 'released')),
      note text not null default '',
      created_by uuid references app_user (id),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (tenant_id, id),
      foreign key (tenant_id, job_id) references job (tenant_id, id),
      foreign key (tenant_id, product_id) references product (tenant_id, id),
      foreign key (tenant_id, batch_id) references stock_batch (tenant_id, id),
      foreign key (tenant_id, location_id) references stock_location (tenant_id, id)
    )`.execute(db);
  await sql`create index reservation_job_idx on reservation (tenant_id, job_id)`.execute(db);
  await sql`create index reservation_active_idx on reservation (tenant_id, product_id)
    where status = 'active'`.execute(db);

  await stockLedger(db);
  await sql`
    create table stock_setting (
      tenant_id uuid primary key references tenant (id),
      allow_negative_stock boolean not null default false,
      expiry_warning_days integer not null default 30 check (expiry_warning_days between 1 and 365),
      default_service_level_bp integer not null default 9500
        check (default_service_level_bp between 5000 and 9999),
      holding_cost_rate_bp integer not null default 2500
        check (holding_cost_rate_bp between 1 and 10000),
      updated_at timestamptz not null default now()
    )`.execute(db);

  const tables = [
    'supplier',
    'product',
    'stock_location',
    'stock_batch',
    'reservation',
    'stock_movement',
    'stock_balance',
    'product_cost_state',
    'stock_setting',
  ];
  for (const table of tables) {
    await sql`alter table ${sql.table(table)} enable row level security`.execute(db);
    await sql`alter table ${sql.table(table)} force row level security`.execute(db);
    await sql`
      create policy tenant_isolation on ${sql.table(table)}
      using (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)
      with check (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)`.execute(
      db,
    );
  }
  await sql`grant select, insert, update, delete on supplier, stock_location to latchwork_app`.execute(
    db,
  );
  // Products and batches that have moved are referenced by the ledger: deactivate, not delete.
  await sql`grant select, insert, update on product, stock_batch, reservation, stock_balance,
    product_cost_state, stock_setting to latchwork_app`.execute(db);
  // The ledger is append-only: a mistake is corrected by a reversing movement.
  await sql`grant select, insert on stock_movement to latchwork_app`.execute(db);
}

/** The ledger, the balance summary it keeps and the per-product weighted-average state. */
async function stockLedger(db: Kysely<any>): Promise<void> {
  await sql`
    create table stock_movement (
      id uuid primary key default gen_random_uuid(),
      seq bigint generated always as identity,
      tenant_id uuid not null references tenant (id),
      kind text not null check (kind in ('receipt', 'transfer', 'issue', 'return',
        'adjustment', 'count_correction', 'write_off')),
      product_id uuid not null,
      batch_id uuid,
      from_location_id uuid,
      to_location_id uuid,
      quantity bigint not null check (quantity > 0),
      unit_cost_minor bigint not null check (unit_cost_minor >= 0),
      value_minor bigint not null,
      settlement_minor bigint not null default 0,
      job_id uuid,
      reservation_id uuid,
      write_off_reason text check (write_off_reason in ('damaged', 'expired', 'lost')),
      reverses_movement_id uuid,
      override_reason text,
      note text not null default '',
      user_id uuid references app_user (id),
      at timestamptz not null default now(),
      unique (tenant_id, id),
      foreign key (tenant_id, product_id) references product (tenant_id, id),
      foreign key (tenant_id, batch_id) references stock_batch (tenant_id, id),
      foreign key (tenant_id, from_location_id) references stock_location (tenant_id, id),
      foreign key (tenant_id, to_location_id) references stock_location (tenant_id, id),
      foreign key (tenant_id, job_id) references job (tenant_id, id),
      foreign key (tenant_id, reservation_id) references reservation (tenant_id, id),
      foreign key (tenant_id, reverses_movement_id) references stock_movement (tenant_id, id),
      check (from_location_id is not null or to_location_id is not null),
      check (from_location_id is distinct from to_location_id),
      check ((kind = 'write_off') = (write_off_reason is not null)
        or reverses_movement_id is not null)
    )`.execute(db);
  await sql`create index stock_movement_product_idx on stock_movement (tenant_id, product_id, seq)`.execute(
    db,
  );
  await sql`create index stock_movement_job_idx on stock_movement (tenant_id, job_id)
    where job_id is not null`.execute(db);
  await sql`create index stock_movement_at_idx on stock_movement (tenant_id, at)`.execute(db);
  // A movement is reversed at most once.
  await sql`create unique index stock_movement_reverses_idx on stock_movement
    (tenant_id, reverses_movement_id) where reverses_movement_id is not null`.execute(db);

  await sql`
    create table stock_balance (
      tenant_id uuid not null references tenant (id),
      product_id uuid not null,
      batch_id uuid,
      location_id uuid not null,
      quantity bigint not null default 0,
      updated_at timestamptz not null default now(),
      unique nulls not distinct (tenant_id, product_id, batch_id, location_id),
      foreign key (tenant_id, product_id) references product (tenant_id, id),
      foreign key (tenant_id, batch_id) references stock_batch (tenant_id, id),
      foreign key (tenant_id, location_id) references stock_location (tenant_id, id)
    )`.execute(db);
  await sql`create index stock_balance_location_idx on stock_balance (tenant_id, location_id)`.execute(
    db,
  );

  await sql`
    create table product_cost_state (
      tenant_id uuid not null references tenant (id),
      product_id uuid not null,
      quantity bigint not null default 0,
      value_minor bigint not null default 0,
      last_unit_cost_minor bigint,
      updated_at timestamptz not null default now(),
      primary key (tenant_id, product_id),
      foreign key (tenant_id, product_id) references product (tenant_id, id)
    )`.execute(db);
}
