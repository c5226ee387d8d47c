import { Router } from 'express';
import type { AdminUserResponse, AdminUsersResponse, AuditResponse } from '../../shared/schemas/admin';
import { AdminUserParams, UpdateAdminUserInput } from '../../shared/schemas/admin';
import type { AppDeps } from '../context';
import { requireRole, requireUser } from '../middleware/auth';
import { parseBody, parseParams } from '../middleware/validate';
import { listUsers } from '../services/users/list';
import { listAudit } from '../services/users/list-audit';
import { updateUserByAdmin } from '../services/users/update';

export function adminRouter({ db }: AppDeps) {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/users', async (_req, res) => {
    res.json({ users: await listUsers(db) } satisfies AdminUsersResponse);
  });
  router.patch('/users/:id', async (req, res) => {
    const { id } = parseParams(AdminUserParams, req);
    const input = parseBody(UpdateAdminUserInput, req);
    res.json({ user: await updateUserByAdmin(db, requireUser(req), id, input) } satisfies AdminUserResponse);
  });
  router.get('/audit', async (_req, res) => {
    res.json({ entries: await listAudit(db) } satisfies AuditResponse);
  });
  return router;
}
