import { Router } from 'express';
import { z } from 'zod';
import { adminListUsersSchema, adminUpdateUserSchema } from '../../shared/schemas/auth';
import type { AppContext } from '../context';
import { currentMember, requireRole } from '../middleware/authenticate';
import { validate, valid } from '../middleware/validate';
import { presentAdminUser } from '../presenters/member.presenter';
import { listMembers, updateMemberAsAdmin } from '../services/admin.service';

const idParams = z.object({ id: z.coerce.number().int().positive('Use a member id.') });

/** /api/admin: the member list, role changes and disabling (admins only). */
export function adminRouter(ctx: AppContext): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/users', validate('query', adminListUsersSchema), async (_req, res) => {
    const query = valid(res, 'query', adminListUsersSchema);
    const { rows, total } = await listMembers(ctx, query);
    res.json({
      items: rows.map(presentAdminUser),
      total,
      page: query.page,
      pageSize: query.pageSize,
    });
  });

  router.patch(
    '/users/:id',
    validate('params', idParams),
    validate('body', adminUpdateUserSchema),
    async (req, res) => {
      const user = await updateMemberAsAdmin(
        ctx,
        currentMember(req),
        valid(res, 'params', idParams).id,
        valid(res, 'body', adminUpdateUserSchema),
      );
      res.json({ member: presentAdminUser(user) });
    },
  );

  return router;
}
