/**
 * Checks of a product body against the firm's data: attributes fit the kind, the preferred
 * supplier and kit components are the firm's, and the stock unit's decimals stay as they are
 * once stock has moved (the ledger's quantities are counted in them).
 */
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { ConflictError } from '@latchwork/shared-server-kit';
import { attributeProblems } from '@latchwork/stock-domain';
import { throwProblems, invalidField } from '../stock-errors';
import type { ProductBody } from './catalogue.schemas';
import { existsInFirm } from '../stock-tx';

/** 400 naming the first field at fault, or 409 when the decimals would change under stock. */
export async function checkProductBody(
  tx: Tx,
  scope: TenantScope,
  body: ProductBody,
  productId?: string,
): Promise<void> {
  throwProblems(attributeProblems(body.kind, body.attributes));
  if (
    body.preferredSupplierId &&
    !(await existsInFirm(tx, scope, 'supplier', body.preferredSupplierId))
  )
    invalidField('preferredSupplierId', 'no such supplier');
  const componentIds = body.kitComponents.map((c) => c.productId);
  if (componentIds.length > 0) {
    const found = await tx
      .selectFrom('product')
      .select('id')
      .where('tenantId', '=', scope.tenantId)
      .where('id', 'in', componentIds)
      .execute();
    const known = new Set(found.map((p) => p.id));
    componentIds.forEach((id, i) => {
      if (!known.has(id)) invalidField(`kitComponents.${i}.productId`, 'no such product');
      if (id === productId)
        invalidField(`kitComponents.${i}.productId`, 'a kit cannot contain itself');
    });
  }
  if (!productId) return;
  const before = await tx
    .selectFrom('product')
    .select('decimals')
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', productId)
    .executeTakeFirst();
  if (before && before.decimals !== body.decimals) {
    const moved = await tx
      .selectFrom('stockMovement')
      .select('id')
      .where('tenantId', '=', scope.tenantId)
      .where('productId', '=', productId)
      .limit(1)
      .executeTakeFirst();
    if (moved)
      throw new ConflictError(
        'decimals: the stock unit cannot change once stock has moved; make a new product instead.',
        { problems: [{ path: 'decimals', code: 'unit-in-use', message: 'stock has moved' }] },
      );
  }
}

/** True for PostgreSQL's unique violation of `constraint`. */
export const isUniqueViolation = (err: unknown, constraint: string): boolean =>
  (err as { code?: string; constraint?: string }).code === '23505' &&
  (err as { constraint?: string }).constraint === constraint;
