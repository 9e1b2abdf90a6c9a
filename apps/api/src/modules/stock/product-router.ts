import type { RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { idParamSchema, productInputSchema, productListResponseSchema, productResponseSchema } from '@heatfleet/domain';
import { HttpError } from '../../lib/http-error.ts';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import {
  createProduct,
  getProduct,
  listProducts,
  openSafetyDataSheet,
  saveSafetyDataSheet,
  SDS_MAX_BYTES,
  updateProduct,
} from './product-service.ts';

const sdsUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: SDS_MAX_BYTES, files: 1, fields: 2 },
}).single('file');
const receiveSds: RequestHandler = (req, res, next) =>
  sdsUpload(req, res, (err: unknown) => {
    if (!err) return next();
    if ((err as { code?: string }).code === 'LIMIT_FILE_SIZE')
      return next(new HttpError(413, 'That safety data sheet is over 10 MB.', 'TooLarge'));
    next(new HttpError(422, 'Send the PDF as multipart form data in a field called "file".', 'ValidationFailed'));
  });

export const productRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/products',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'Chemical products',
    request: {},
    responses: { 200: { description: 'Products', schema: productListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ products: await listProducts(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/products',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'Add a product (Owner, Admin, Stores)',
    request: { body: productInputSchema },
    responses: { 201: { description: 'Added', schema: productResponseSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ product: await createProduct(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/products/:id',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'A product',
    request: { params: idParamSchema },
    responses: { 200: { description: 'Product', schema: productResponseSchema } },
    handle: async ({ params, res, deps, actor }) => {
      res.json({ product: await getProduct(deps, actor, params.id) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/products/:id',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'Change a product (Owner, Admin, Stores)',
    request: { params: idParamSchema, body: productInputSchema },
    responses: { 200: { description: 'Changed', schema: productResponseSchema } },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json({ product: await updateProduct(deps, actor, params.id, body) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/products/:id/safety-data-sheet',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'Upload the product\u2019s safety data sheet (multipart field "file", a PDF up to 10 MB)',
    request: { params: idParamSchema },
    multipart: { fileField: 'file', fields: z.strictObject({}) },
    before: () => [receiveSds],
    responses: { 200: { description: 'Stored', schema: productResponseSchema } },
    handle: async ({ params, req, res, deps, actor }) => {
      if (!req.file)
        throw new HttpError(422, 'Attach the PDF in the field "file".', 'ValidationFailed', [
          { path: 'file', message: 'Required' },
        ]);
      res.json({ product: await saveSafetyDataSheet(deps, actor, params.id, req.file.buffer) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/products/:id/safety-data-sheet',
    tag: 'Stock',
    access: 'member',
    tenantData: true,
    summary: 'The safety data sheet, as a download',
    request: { params: idParamSchema },
    responses: { 200: { description: 'PDF' } },
    handle: async ({ params, res, deps, actor }) => {
      const { name, body } = await openSafetyDataSheet(deps, actor, params.id);
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader(
        'Content-Disposition',
        `attachment; filename="${name.replace(/[^A-Za-z0-9 ._-]/g, '')} safety data sheet.pdf"`,
      );
      res.setHeader('X-Content-Type-Options', 'nosniff');
      body.pipe(res);
    },
  }),
];
