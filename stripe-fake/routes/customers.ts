import { Router } from 'express';
import { z } from 'zod';
import type { FakeContext } from '../context';
import { present } from '../expand';
import { listParams, toList } from '../listing';
import { expandParam, metadataParam, parseParams } from '../params';
import { createCustomer, updateCustomer } from '../services/customers';

const customerFields = z.strictObject({
  email: z.string().optional(),
  name: z.string().optional(),
  description: z.string().optional(),
  phone: z.string().optional(),
  metadata: metadataParam.optional(),
  expand: expandParam,
});
const retrieveParams = z.strictObject({ expand: expandParam });
const listCustomerParams = z.strictObject({ ...listParams, email: z.string().optional() });

export function customerRoutes(ctx: FakeContext): Router {
  const router = Router();

  router.post('/customers', (req, res) => {
    const { expand, ...fields } = parseParams(customerFields, req.body);
    res.json(present(ctx.state, createCustomer(ctx, fields), expand));
  });

  router.get('/customers', (req, res) => {
    const { email, expand, ...page } = parseParams(listCustomerParams, req.query);
    const customers = ctx.state.customers.newestFirst((customer) => !email || customer.email === email);
    res.json(present(ctx.state, toList(customers, page, '/v1/customers'), expand));
  });

  router.get('/customers/:id', (req, res) => {
    const { expand } = parseParams(retrieveParams, req.query);
    res.json(present(ctx.state, ctx.state.customers.find(req.params.id), expand));
  });

  router.post('/customers/:id', (req, res) => {
    const { expand, ...fields } = parseParams(customerFields, req.body);
    res.json(present(ctx.state, updateCustomer(ctx.state.customers.find(req.params.id), fields), expand));
  });

  return router;
}
