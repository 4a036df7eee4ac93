import type { components } from '../../shared/contract/api-types';
import type { Transaction } from 'sequelize';
import { recordAudit } from '../audit/record-audit';
import { actorUserId, type Actor } from '../auth/actor';
import { newId } from '../db/ids';
import type { User, UserRole } from '../db/models/user';
import { conflict, notFound } from '../http/problem';
import { invitationMessage } from '../mail/messages';
import type { Services } from '../services';
import { normalizeEmail } from '../session/credentials';
import {
  generateInvitationToken,
  hashInvitationToken,
  INVITATION_LIFETIME_MS,
  invitationUrl,
} from './invitation-token';
import { toUserView } from './user-view';

export interface InviteUserInput {
  email: string;
  role: UserRole;
  name?: string | null;
}

/** The answer to an invitation (the contract's `UserInvitationResult`). */
export type InviteUserResult = components['schemas']['UserInvitationResult'];

/**
 * The one-time link; returned to the admin too, so it can be passed on by hand if the mail is lost, and
 * whether the mail left.
 */
export type IssuedInvitation = InviteUserResult['invitation'];

type InvitationServices = Pick<Services, 'db' | 'config' | 'mail'>;

async function createInvitation(
  services: InvitationServices,
  user: User,
  createdById: string | null,
  transaction: Transaction,
): Promise<{ token: string; expiresAt: Date }> {
  const token = generateInvitationToken();
  const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_MS);
  await services.db.models.Invitation.create(
    {
      id: newId('inv'),
      userId: user.id,
      tokenHash: hashInvitationToken(token),
      expiresAt,
      usedAt: null,
      createdById,
    },
    { transaction },
  );
  return { token, expiresAt };
}

async function mailInvitation(
  services: InvitationServices,
  actor: Actor,
  user: User,
  issued: { token: string; expiresAt: Date },
): Promise<IssuedInvitation> {
  const url = invitationUrl(services.config.publicUrl, issued.token);
  const inviterId = actorUserId(actor);
  const inviter = inviterId ? await services.db.models.User.findByPk(inviterId) : null;
  const emailSent = await services.mail.send(
    invitationMessage({
      to: user.email,
      name: user.name,
      role: user.role,
      url,
      expiresAt: issued.expiresAt,
      invitedBy: inviter?.email ?? null,
    }),
  );
  return { url, expiresAt: issued.expiresAt.toISOString(), emailSent };
}

/**
 * Creates a user who has not chosen a password yet and e-mails them a one-time link to do so. Also
 * used by the operator command line.
 */
export async function inviteUser(
  services: InvitationServices,
  actor: Actor,
  input: InviteUserInput,
): Promise<InviteUserResult> {
  const { User } = services.db.models;
  const email = normalizeEmail(input.email);
  const createdById = actorUserId(actor);
  const { user, issued } = await services.db.write(async (transaction) => {
    if (await User.findOne({ where: { email }, transaction })) {
      throw conflict('A user with this e-mail address already exists.', [
        { pointer: '/body/email', message: 'is already in use' },
      ]);
    }
    const created = await User.create(
      {
        id: newId('usr'),
        email,
        name: input.name ?? null,
        role: input.role,
        status: 'invited',
        passwordHash: null,
        lastSignInAt: null,
      },
      { transaction },
    );
    const invitation = await createInvitation(services, created, createdById, transaction);
    await recordAudit(
      services.db.models,
      actor,
      {
        action: 'user.invited',
        targetType: 'user',
        targetId: created.id,
        details: { email, role: input.role },
      },
      transaction,
    );
    return { user: created, issued: invitation };
  });
  return { user: toUserView(user), invitation: await mailInvitation(services, actor, user, issued) };
}

/**
 * A fresh link for someone who has not accepted yet (the first one expired or went astray). Earlier
 * links of that user stop working.
 */
export async function reissueInvitation(
  services: InvitationServices,
  actor: Actor,
  userId: string,
): Promise<InviteUserResult> {
  const { User, Invitation } = services.db.models;
  const { user, issued } = await services.db.write(async (transaction) => {
    const found = await User.findByPk(userId, { transaction });
    if (!found) throw notFound(`No user ${userId}.`);
    if (found.status !== 'invited') {
      throw conflict(
        `The user is ${found.status}; only a user who has not accepted an invitation yet can get a new one.`,
      );
    }
    await Invitation.update({ usedAt: new Date() }, { where: { userId, usedAt: null }, transaction });
    const invitation = await createInvitation(services, found, actorUserId(actor), transaction);
    await recordAudit(
      services.db.models,
      actor,
      {
        action: 'user.invited',
        targetType: 'user',
        targetId: found.id,
        details: { email: found.email, role: found.role, reissued: true },
      },
      transaction,
    );
    return { user: found, issued: invitation };
  });
  return { user: toUserView(user), invitation: await mailInvitation(services, actor, user, issued) };
}
