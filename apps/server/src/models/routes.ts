import { Router } from 'express';
import {
  createModelRequestSchema,
  idSchema,
  modelListQuerySchema,
  updateModelRequestSchema,
} from '@biasproof/shared';
import { authorize, orgContextOf } from '../orgs/org-scope.ts';
import {
  createModel,
  deleteModel,
  getModel,
  listModels,
  noSuchModel,
  updateModel,
} from './model-library.ts';

/** A malformed id names nothing: 404, like an id from another organization. */
function modelId(raw: unknown): string {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw noSuchModel();
  return parsed.data;
}

/** `/api/orgs/:orgId/models/…`: the organization's model library. */
export function modelLibraryRoutes(): Router {
  const router = Router();
  router.get('/', authorize('read', 'ModelLibrary'), async (req, res) => {
    res.json(await listModels(orgContextOf(res), modelListQuerySchema.parse(req.query)));
  });
  router.post('/', authorize('create', 'ModelLibrary'), async (req, res) => {
    const input = createModelRequestSchema.parse(req.body);
    res.status(201).json(await createModel(orgContextOf(res), input));
  });
  router.get('/:id', authorize('read', 'ModelLibrary'), async (req, res) => {
    res.json(await getModel(orgContextOf(res), modelId(req.params.id)));
  });
  router.patch('/:id', authorize('update', 'ModelLibrary'), async (req, res) => {
    const id = modelId(req.params.id);
    const input = updateModelRequestSchema.parse(req.body);
    res.json(await updateModel(orgContextOf(res), id, input));
  });
  router.delete('/:id', authorize('delete', 'ModelLibrary'), async (req, res) => {
    await deleteModel(orgContextOf(res), modelId(req.params.id));
    res.status(204).end();
  });
  return router;
}
