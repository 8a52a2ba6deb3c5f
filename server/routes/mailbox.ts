import { Router } from 'express';
import { z } from 'zod';
import { idParamsSchema } from '../../shared/ids';
import type { Config } from '../config';
import { AppError } from '../errors';
import { currentUser, requireRole, requireSignIn } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { getMailboxAttachment, getMailboxMessage, getMailboxRaw, listMailbox } from '../mail/mailbox';

const listQuerySchema = z.object({ to: z.string().trim().max(254).optional() });
const attachmentParamsSchema = idParamsSchema.extend({ index: z.coerce.number().int().min(0).max(100) });

/**
 * The local mailbox, for admins outside production. In production the whole path answers 404 for everyone,
 * signed in or not, which is also how the client learns to hide its link.
 */
export function mailboxRoutes(config: Config): Router {
  const router = Router();
  router.use((_req, _res, next) => next(config.env === 'production' ? AppError.notFound('Mailbox') : undefined));
  router.use(requireSignIn, requireRole('admin'));

  router.get('/', async (req, res) => {
    const { to } = parseInput(listQuerySchema, req.query);
    res.json({ items: await listMailbox(currentUser(req), { to }) });
  });

  router.get('/:id', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ message: await getMailboxMessage(currentUser(req), id) });
  });

  router.get('/:id/raw', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.type('message/rfc822').attachment(`${id}.eml`).send(await getMailboxRaw(currentUser(req), id));
  });

  router.get('/:id/attachments/:index', async (req, res) => {
    const { id, index } = parseInput(attachmentParamsSchema, req.params);
    const attachment = await getMailboxAttachment(currentUser(req), id, index);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.type(attachment.contentType).attachment(attachment.filename ?? `attachment-${index}`).send(attachment.content);
  });

  return router;
}
