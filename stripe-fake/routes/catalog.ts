import { Router } from 'express';
import { z } from 'zod';
import type { FakeContext } from '../context';
import { present } from '../expand';
import { listParams, toList } from '../listing';
import { expandParam, formBoolean, parseParams } from '../params';

const retrieveParams = z.strictObject({ expand: expandParam });
const listProductParams = z.strictObject({ ...listParams, active: formBoolean.optional() });
const listPriceParams = z.strictObject({
  ...listParams,
  active: formBoolean.optional(),
  product: z.string().optional(),
  type: z.enum(['recurring', 'one_time']).optional(),
  lookup_keys: z.array(z.string()).max(10).optional(),
});

/** The seat product and its prices, read-only: the fake creates them when it starts. */
export function catalogRoutes(ctx: FakeContext): Router {
  const router = Router();

  router.get('/products', (req, res) => {
    const { active, expand, ...page } = parseParams(listProductParams, req.query);
    const products = ctx.state.products.newestFirst((product) => active === undefined || product.active === active);
    res.json(present(ctx.state, toList(products, page, '/v1/products'), expand));
  });

  router.get('/products/:id', (req, res) => {
    const { expand } = parseParams(retrieveParams, req.query);
    res.json(present(ctx.state, ctx.state.products.find(req.params.id), expand));
  });

  router.get('/prices', (req, res) => {
    const { active, product, type, lookup_keys: lookupKeys, expand, ...page } = parseParams(listPriceParams, req.query);
    const prices = ctx.state.prices.newestFirst(
      (price) =>
        (active === undefined || price.active === active) &&
        (!product || price.product === product) &&
        (!type || price.type === type) &&
        (!lookupKeys || (price.lookup_key !== null && lookupKeys.includes(price.lookup_key))),
    );
    res.json(present(ctx.state, toList(prices, page, '/v1/prices'), expand));
  });

  router.get('/prices/:id', (req, res) => {
    const { expand } = parseParams(retrieveParams, req.query);
    res.json(present(ctx.state, ctx.state.prices.find(req.params.id), expand));
  });

  return router;
}
