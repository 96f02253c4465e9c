import { Router } from 'express';
import { z } from 'zod';
import { AcceptInvitationInputSchema, InvitationInputSchema } from '../../shared/account';
import type { Db } from '../db/client';
import { currentUser, requireRole } from '../auth/require-role';
import { signIn } from '../auth/sign-in';
import { accountLink } from '../mail/links';
import { sendOrLog } from '../mail/send';
import { invitationMail } from '../mail/templates';
import type { Mailer } from '../mail/transport';
import { acceptInvitation, inviteAccount, resendInvitation, type Invitation } from '../services/invitations.service';

const UserIdParam = z.object({ userId: z.coerce.number().int().positive() });

export function invitationRoutes({ db, mailer, log }: { db: Db; mailer: Mailer; log: (m: string) => void }): Router {
  const router = Router();

  const mailAndAnswer = async (inv: Invitation) => {
    const msg = invitationMail(
      inv.account.email,
      inv.account.role,
      inv.clinicName,
      accountLink('acceptInvitation', inv.token),
    );
    const mailSent = await sendOrLog(mailer, msg, 'invitation', log);
    return { account: inv.account, expiresAt: inv.expiresAt.toISOString(), mailSent };
  };

  router.post('/invitations', requireRole('steward', 'lead'), async (req, res) => {
    const inv = await inviteAccount(db, currentUser(req), InvitationInputSchema.parse(req.body));
    res.status(201).json(await mailAndAnswer(inv));
  });

  // Public: the token is the credential. The new account is signed in straight away.
  router.post('/invitations/accept', async (req, res) => {
    const user = await acceptInvitation(db, AcceptInvitationInputSchema.parse(req.body));
    await signIn(db, req, user);
    res.json({ user });
  });

  router.post('/invitations/:userId/resend', requireRole('steward', 'lead'), async (req, res) => {
    const { userId } = UserIdParam.parse(req.params);
    res.json(await mailAndAnswer(await resendInvitation(db, currentUser(req), userId)));
  });

  return router;
}
