import { Router } from 'express';
import {
  createProjectRequestSchema,
  idSchema,
  projectListQuerySchema,
  updateProjectRequestSchema,
} from '@biasproof/shared';
import { authorize, orgContextOf } from '../orgs/org-scope.ts';
import {
  createProject,
  getProject,
  listProjects,
  noSuchProject,
  updateProject,
} from './projects.ts';

/** A malformed id names nothing: 404, like an id from another organization. */
function projectId(raw: unknown): string {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw noSuchProject();
  return parsed.data;
}

/** `/api/orgs/:orgId/projects/…` (there is no delete: projects are archived). */
export function projectRoutes(): Router {
  const router = Router();
  router.get('/', authorize('read', 'Project'), async (req, res) => {
    res.json(await listProjects(orgContextOf(res), projectListQuerySchema.parse(req.query)));
  });
  router.post('/', authorize('create', 'Project'), async (req, res) => {
    const input = createProjectRequestSchema.parse(req.body);
    res.status(201).json(await createProject(orgContextOf(res), input));
  });
  router.get('/:id', authorize('read', 'Project'), async (req, res) => {
    res.json(await getProject(orgContextOf(res), projectId(req.params.id)));
  });
  router.patch('/:id', authorize('update', 'Project'), async (req, res) => {
    const id = projectId(req.params.id);
    const input = updateProjectRequestSchema.parse(req.body);
    res.json(await updateProject(orgContextOf(res), id, input));
  });
  return router;
}
