import { withTenant } from '@latchwork/shared-db';
import { endpoint, NotFoundError, scopeOf } from '@latchwork/shared-server-kit';
import type { StockDeps } from '../stock-deps';
import { conflictField } from '../stock-errors';
import { productBody, productIdParams, productQuery, type ProductBody } from './catalogue.schemas';
import { checkProductBody, isUniqueViolation } from './product-rules';
import { findProduct, insertProduct, listProducts, updateProduct } from './product.repository';

/** A SKU already used in the firm: 409 naming the field. */
function duplicateSku(err: unknown, body: ProductBody): never {
  if (isUniqueViolation(err, 'product_tenant_id_sku_key'))
    conflictField('sku', 'duplicate-sku', `SKU ${body.sku} is already in the catalogue.`);
  throw err;
}

/** The catalogue's products: list with search and kind filter, create, read, replace. */
export function productEndpoints(deps: StockDeps) {
  return [
    endpoint({
      method: 'get',
      path: '/stock/products',
      summary: 'Catalogue: products with on hand, reserved, available and value; search and filter',
      tags: ['stock'],
      permission: 'stock:read',
      query: productQuery,
      handle: ({ query, req }) =>
        withTenant(deps.db, scopeOf(req), (tx) => listProducts(tx, scopeOf(req), query)),
    }),
    endpoint({
      method: 'post',
      path: '/stock/products',
      summary: 'Add a product to the catalogue',
      tags: ['stock'],
      permission: 'stock:write',
      status: 201,
      body: productBody,
      async handle({ body, req }) {
        const scope = scopeOf(req);
        return withTenant(deps.db, scope, async (tx) => {
          await checkProductBody(tx, scope, body);
          const id = await insertProduct(tx, scope, body).catch((e) => duplicateSku(e, body));
          return findProduct(tx, scope, id);
        });
      },
    }),
    endpoint({
      method: 'get',
      path: '/stock/products/:productId',
      summary: 'One product with its stock figures',
      tags: ['stock'],
      permission: 'stock:read',
      params: productIdParams,
      async handle({ params, req }) {
        const scope = scopeOf(req);
        const found = await withTenant(deps.db, scope, (tx) =>
          findProduct(tx, scope, params.productId),
        );
        if (!found) throw new NotFoundError('That product');
        return found;
      },
    }),
    endpoint({
      method: 'put',
      path: '/stock/products/:productId',
      summary: 'Replace a product’s details (deactivate rather than delete: the ledger keeps it)',
      tags: ['stock'],
      permission: 'stock:write',
      params: productIdParams,
      body: productBody,
      async handle({ params, body, req }) {
        const scope = scopeOf(req);
        return withTenant(deps.db, scope, async (tx) => {
          if (!(await findProduct(tx, scope, params.productId)))
            throw new NotFoundError('That product');
          await checkProductBody(tx, scope, body, params.productId);
          await updateProduct(tx, scope, params.productId, body).catch((e) =>
            duplicateSku(e, body),
          );
          return findProduct(tx, scope, params.productId);
        });
      },
    }),
  ];
}
