import { sql, type Kysely } from 'kysely';

/**
 * Stock counts (a snapshot per line, the blind counts, the variance booked at posting),
 * purchase orders with their gapless per-firm numbers, goods received against them, and the
 * firm's count and reorder settings. Quantities are integer steps, money integer minor units,
 * both `bigint`, as in the ledger (2026_12_02_0200).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table stock_control_setting (
      tenant_id uuid primary key references tenant (id),
      count_approval_gross_minor bigint not null default 10000
        check (count_approval_gross_minor >= 0),
      count_approval_line_minor bigint check (count_approval_line_minor >= 0),
      demand_window_days integer not null default 90 check (demand_window_days between 7 and 730),
      nightly_reorder boolean not null default true,
      default_order_cost_minor bigint not null default 2500 check (default_order_cost_minor >= 0),
      delivery_location_id uuid,
      updated_at timestamptz not null default now(),
      foreign key (tenant_id, delivery_location_id) references stock_location (tenant_id, id)
    )`.execute(db);

  await counts(db);
  await purchasing(db);

  const tables = [
    'stock_control_setting',
    'stock_count',
    'stock_count_line',
    'purchase_order_counter',
    'purchase_order',
    'purchase_order_line',
    'goods_receipt',
    'goods_receipt_line',
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
  await sql`grant select, insert, update on stock_control_setting, stock_count, stock_count_line,
    purchase_order_counter, purchase_order to latchwork_app`.execute(db);
  // Draft lines are replaced when a draft is edited; sent orders refuse it in the service.
  await sql`grant select, insert, update, delete on purchase_order_line to latchwork_app`.execute(
    db,
  );
  // What arrived is a record like the ledger it booked: never edited.
  await sql`grant select, insert on goods_receipt, goods_receipt_line to latchwork_app`.execute(db);
}

async function counts(db: Kysely<any>): Promise<void> {
  await sql`
    create table stock_count (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      location_id uuid not null,
      scope text not null check (scope in ('all', 'chosen')),
      status text not null default 'counting'
        check (status in ('counting', 'submitted', 'posted', 'cancelled')),
      note text not null default '',
      started_by uuid references app_user (id),
      started_at timestamptz not null default now(),
      submitted_by uuid references app_user (id),
      submitted_at timestamptz,
      approved_by uuid references app_user (id),
      approved_at timestamptz,
      posted_by uuid references app_user (id),
      posted_at timestamptz,
      net_value_minor bigint,
      gross_value_minor bigint,
      unique (tenant_id, id),
      foreign key (tenant_id, location_id) references stock_location (tenant_id, id)
    )`.execute(db);
  await sql`create index stock_count_idx on stock_count (tenant_id, started_at desc)`.execute(db);

  await sql`
    create table stock_count_line (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      count_id uuid not null,
      position integer not null,
      product_id uuid not null,
      batch_id uuid,
      expected_at_start bigint not null,
      counted bigint check (counted >= 0),
      counted_by uuid references app_user (id),
      counted_at timestamptz,
      reason text check (reason in ('miscount', 'damaged', 'lost', 'unrecorded_issue',
        'unrecorded_receipt', 'wrong_location', 'other')),
      reason_note text not null default '',
      -- Filled at posting: what was expected when the line was counted, and what was booked.
      expected bigint,
      variance bigint,
      unit_cost_minor bigint,
      variance_value_minor bigint,
      movement_id uuid,
      unique nulls not distinct (tenant_id, count_id, product_id, batch_id),
      foreign key (tenant_id, count_id) references stock_count (tenant_id, id),
      foreign key (tenant_id, product_id) references product (tenant_id, id),
      foreign key (tenant_id, batch_id) references stock_batch (tenant_id, id),
      foreign key (tenant_id, movement_id) references stock_movement (tenant_id, id)
    )`.execute(db);
  await sql`create index stock_count_line_idx on stock_count_line (tenant_id, count_id, position)`.execute(
    db,
  );
}

async function purchasing(db: Kysely<any>): Promise<void> {
  await sql`
    create table purchase_order_counter (
      tenant_id uuid primary key references tenant (id),
      last_number integer not null check (last_number >= 0)
    )`.execute(db);

  await sql`
    create table purchase_order (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      number integer not null check (number > 0),
      reference text not null,
      supplier_id uuid not null,
      status text not null default 'draft'
        check (status in ('draft', 'sent', 'part_received', 'received', 'cancelled')),
      source text not null default 'manual' check (source in ('manual', 'reorder')),
      delivery_location_id uuid,
      expected_on date,
      notes text not null default '',
      created_by uuid references app_user (id),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      sent_by uuid references app_user (id),
      sent_at timestamptz,
      sent_to citext,
      email_log_id uuid,
      cancelled_by uuid references app_user (id),
      cancelled_at timestamptz,
      cancel_reason text,
      unique (tenant_id, id),
      unique (tenant_id, number),
      foreign key (tenant_id, supplier_id) references supplier (tenant_id, id),
      foreign key (tenant_id, delivery_location_id) references stock_location (tenant_id, id)
    )`.execute(db);
  await sql`create index purchase_order_status_idx on purchase_order
    (tenant_id, status, created_at desc)`.execute(db);
  await sql`create index purchase_order_supplier_idx on purchase_order (tenant_id, supplier_id)`.execute(
    db,
  );

  await sql`
    create table purchase_order_line (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      purchase_order_id uuid not null,
      position integer not null,
      product_id uuid not null,
      quantity bigint not null check (quantity > 0),
      unit_cost_minor bigint not null check (unit_cost_minor >= 0),
      received_quantity bigint not null default 0 check (received_quantity >= 0),
      damaged_quantity bigint not null default 0 check (damaged_quantity >= 0),
      note text not null default '',
      unique (tenant_id, id),
      unique (tenant_id, purchase_order_id, product_id),
      foreign key (tenant_id, purchase_order_id) references purchase_order (tenant_id, id),
      foreign key (tenant_id, product_id) references product (tenant_id, id)
    )`.execute(db);
  // The reorder run asks "is this product on an open order already?" for every product.
  await sql`create index purchase_order_line_product_idx on purchase_order_line
    (tenant_id, product_id)`.execute(db);

  await sql`
    create table goods_receipt (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      purchase_order_id uuid not null,
      location_id uuid not null,
      received_on date not null,
      note text not null default '',
      received_by uuid references app_user (id),
      created_at timestamptz not null default now(),
      unique (tenant_id, id),
      foreign key (tenant_id, purchase_order_id) references purchase_order (tenant_id, id),
      foreign key (tenant_id, location_id) references stock_location (tenant_id, id)
    )`.execute(db);
  await sql`create index goods_receipt_po_idx on goods_receipt (tenant_id, purchase_order_id)`.execute(
    db,
  );

  await sql`
    create table goods_receipt_line (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      goods_receipt_id uuid not null,
      purchase_order_line_id uuid not null,
      product_id uuid not null,
      batch_id uuid,
      quantity bigint not null check (quantity >= 0),
      damaged_quantity bigint not null default 0 check (damaged_quantity >= 0),
      unit_cost_minor bigint not null check (unit_cost_minor >= 0),
      receipt_movement_id uuid,
      write_off_movement_id uuid,
      check (quantity + damaged_quantity > 0),
      foreign key (tenant_id, goods_receipt_id) references goods_receipt (tenant_id, id),
      foreign key (tenant_id, purchase_order_line_id) references purchase_order_line (tenant_id, id),
      foreign key (tenant_id, product_id) references product (tenant_id, id),
      foreign key (tenant_id, batch_id) references stock_batch (tenant_id, id),
      foreign key (tenant_id, receipt_movement_id) references stock_movement (tenant_id, id),
      foreign key (tenant_id, write_off_movement_id) references stock_movement (tenant_id, id)
    )`.execute(db);
  await sql`create index goods_receipt_line_idx on goods_receipt_line (tenant_id, goods_receipt_id)`.execute(
    db,
  );
}
