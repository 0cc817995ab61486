import { Router } from 'express';
import { z } from 'zod';
import { ROLES } from '@shared/auth/roles';
import { USER_SORTS } from '@shared/users/user';
import { principalOf, requireCapability } from '../../../platform/auth/guards';
import { idParam, pageQuerySchema, validate } from '../../../platform/validation';
import type { UsersService } from '../domain/users-service';

const inviteBody = z.strictObject({
  email: z.string().trim().toLowerCase().email('must be an e-mail address').max(254),
  displayName: z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  role: z.enum(ROLES, { message: `must be one of ${ROLES.join(', ')}` }),
});
const patchBody = z
  .strictObject({ role: z.enum(ROLES).optional(), status: z.enum(['active', 'disabled']).optional() })
  .refine((b) => b.role || b.status, { message: 'give a role or a status' });

/** /api/users: the active organisation's members. Administrators only. */
export function usersRouter(users: UsersService): Router {
  const router = Router();
  router.use(requireCapability('manageUsers'));

  router.get('/', async (req, res) => {
    res.json(
      await users.list(principalOf(req), validate(pageQuerySchema(USER_SORTS, 'displayName'), req.query, 'Query')),
    );
  });

  router.post('/invitations', async (req, res) => {
    res.status(201).json(await users.invite(principalOf(req), validate(inviteBody, req.body, 'Invitation')));
  });

  router.patch('/:id', async (req, res) => {
    const { id } = validate(idParam, req.params);
    res.json(await users.update(principalOf(req), id, validate(patchBody, req.body, 'User')));
  });

  router.post('/:id/password-reset', async (req, res) => {
    await users.sendPasswordReset(principalOf(req), validate(idParam, req.params).id);
    res.status(202).json({ sent: true });
  });

  return router;
}
