/**
 * E-mail invites into a sightline's crew: the owner invites an address with a role; the link in
 * the e-mail is signed, works once, for that address only, and expires. An invitee without an
 * account registers from the link and lands on the sightline.
 */
import { randomUUID } from 'node:crypto';
import { Op, UniqueConstraintError, type Sequelize } from 'sequelize';
import type { CrewInviteInput, CrewInviteCreated, InviteLookup } from '../../shared/schemas/crew';
import { INVITE_VALID_DAYS } from '../../shared/schemas/crew';
import type { CrewRole } from '../../shared/policy/sightline-policy';
import { AppError } from '../errors';
import type { Mailer } from '../mail/mailer';
import { renderInviteEmail } from '../mail/invite-email';
import { CrewInviteModel } from '../models/crew-invite';
import { CrewMemberModel } from '../models/crew-member';
import { SightlineModel } from '../models/sightline';
import { UserModel } from '../models/user';
import { InviteTokenError, InviteTokens } from './invite-tokens';
import type { SightlineService } from './sightline-service';

const DAY_MS = 86_400_000;
/** Most invite e-mails one sightline sends in a day: the app's mailer is not for mass mail. */
export const MAX_INVITES_PER_SIGHTLINE_PER_DAY = 30;

export interface InviteServiceOptions {
  /** The address people open, e.g. https://gnomon.example.org (no trailing slash). */
  appUrl: string;
  /** From header of invite e-mails. */
  mailFrom: string;
  jwtSecret: string;
  clock?: () => Date;
}

export class InviteService {
  private readonly tokens: InviteTokens;
  private readonly clock: () => Date;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly sightlines: SightlineService,
    private readonly mailer: Mailer,
    private readonly options: InviteServiceOptions,
  ) {
    this.tokens = new InviteTokens(options.jwtSecret);
    this.clock = options.clock ?? (() => new Date());
  }

  /** The link of an invite, as it goes in the e-mail. */
  linkFor(invite: CrewInviteModel): string {
    return `${this.options.appUrl}/invites/accept?token=${encodeURIComponent(this.tokens.sign(invite.id, invite.expiresAt))}`;
  }

  /**
   * Creates an invite (replacing an open one to the same address) and e-mails it. A failed e-mail
   * does not undo the invite: the answer says so and carries the link to pass on another way.
   */
  async create(user: UserModel, sightlineId: string, input: CrewInviteInput): Promise<CrewInviteCreated> {
    const now = this.clock();
    const invite = await this.sequelize.transaction(async (transaction) => {
      const sightline = await this.sightlines.get(user, sightlineId, 'manage-crew', transaction);
      const sentToday = await CrewInviteModel.count({ where: { sightlineId, createdAt: { [Op.gt]: new Date(now.getTime() - DAY_MS) } }, transaction });
      if (sentToday >= MAX_INVITES_PER_SIGHTLINE_PER_DAY) {
        throw new AppError('rate_limited', `This sightline has sent ${MAX_INVITES_PER_SIGHTLINE_PER_DAY} invites in the last day; try again tomorrow`);
      }
      const invitee = await UserModel.findOne({ where: { email: input.email }, transaction });
      if (invitee?.id === sightline.ownerId) throw new AppError('validation', 'That is your own address', { email: 'Invite someone else' });
      if (invitee && (await CrewMemberModel.findOne({ where: { sightlineId, userId: invitee.id }, transaction }))) {
        throw new AppError('conflict', `${invitee.name} is in the crew already; change their role instead`, { email: 'Already in the crew' });
      }
      await CrewInviteModel.update(
        { revokedAt: now },
        { where: { sightlineId, email: input.email, acceptedAt: null, revokedAt: null }, transaction },
      );
      try {
        return await CrewInviteModel.create({
          id: randomUUID(),
          sightlineId,
          email: input.email,
          role: input.role,
          invitedBy: user.id,
          expiresAt: new Date(now.getTime() + INVITE_VALID_DAYS * DAY_MS),
        }, { transaction });
      } catch (error) {
        if (error instanceof UniqueConstraintError) throw new AppError('conflict', 'An invite to that address was just made; reload the crew');
        throw error;
      }
    });
    const sightline = await SightlineModel.findByPk(sightlineId);
    if (!sightline) throw AppError.notFound('No such sightline');
    const link = this.linkFor(invite);
    const mail = renderInviteEmail({ inviterName: user.name, sightlineName: sightline.name, role: input.role, link, expiresAt: invite.expiresAt });
    let mailError: string | null = null;
    try {
      await this.mailer.send({ from: this.options.mailFrom, to: input.email, messageId: `invite-${invite.id}@gnomon`, ...mail });
    } catch (error) {
      mailError = `The invite is saved but the e-mail could not be sent (${(error as Error).message}). Pass the link on another way, or revoke and invite again later.`;
    }
    invite.inviter = user;
    return { invite: invite.toPublic(now), link, mailSent: mailError === null, mailError };
  }

  /** The owner revokes an invite that is still open. */
  async revoke(user: UserModel, sightlineId: string, inviteId: string): Promise<void> {
    await this.sightlines.get(user, sightlineId, 'manage-crew');
    const [count] = await CrewInviteModel.update(
      { revokedAt: this.clock() },
      { where: { id: inviteId, sightlineId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: this.clock() } } },
    );
    if (count === 0) throw AppError.notFound('No open invite with that id');
  }

  private verify(token: string): string {
    try {
      return this.tokens.verify(token, this.clock());
    } catch (error) {
      if (error instanceof InviteTokenError) {
        throw new AppError(error.reason === 'expired' ? 'gone' : 'validation', error.message, { token: error.message });
      }
      throw error;
    }
  }

  /** What an invite link shows before signing in (no sign-in needed; the token is the key). */
  async lookup(token: string): Promise<InviteLookup> {
    const id = this.verify(token);
    const invite = await CrewInviteModel.findByPk(id, { include: [{ model: UserModel, as: 'inviter', attributes: ['id', 'name'] }] });
    if (!invite) throw AppError.notFound('This invite no longer exists');
    const sightline = await SightlineModel.findByPk(invite.sightlineId);
    if (!sightline) throw AppError.notFound('The sightline of this invite was deleted');
    const accountExists = (await UserModel.count({ where: { email: invite.email } })) > 0;
    return {
      sightlineName: sightline.name,
      inviterName: invite.inviter?.name ?? 'former member',
      role: invite.role,
      email: invite.email,
      status: invite.statusAt(this.clock()),
      expiresAt: invite.expiresAt.toISOString(),
      accountExists,
    };
  }

  /**
   * Accepts an invite as the signed-in user. The account's address must be the invited one; the
   * invite closes (a second use is refused). Locks the invite row so two accepts cannot both pass.
   */
  async accept(user: UserModel, token: string): Promise<{ sightlineId: string; role: CrewRole }> {
    const id = this.verify(token);
    return this.sequelize.transaction(async (transaction) => {
      const invite = await CrewInviteModel.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!invite) throw AppError.notFound('This invite no longer exists');
      const status = invite.statusAt(this.clock());
      if (status === 'accepted') throw new AppError('conflict', 'This invite has been used already');
      if (status === 'revoked') throw new AppError('gone', 'This invite was withdrawn by the sightline\'s owner');
      if (status === 'expired') throw new AppError('gone', 'This invite has expired. Ask the sightline\'s owner for a new one.');
      if (invite.email !== user.email.toLowerCase()) {
        throw new AppError('forbidden', `This invite is for ${invite.email}. Sign in with that address to accept it.`);
      }
      const sightline = await SightlineModel.findByPk(invite.sightlineId, { transaction, lock: transaction.LOCK.UPDATE });
      if (!sightline) throw AppError.notFound('The sightline of this invite was deleted');
      if (sightline.ownerId !== user.id) {
        const existing = await CrewMemberModel.findOne({ where: { sightlineId: sightline.id, userId: user.id }, transaction });
        if (existing) await existing.update({ role: invite.role }, { transaction });
        else await CrewMemberModel.create({ sightlineId: sightline.id, userId: user.id, role: invite.role }, { transaction });
      }
      await invite.update({ acceptedAt: this.clock(), acceptedBy: user.id }, { transaction });
      return { sightlineId: sightline.id, role: invite.role };
    });
  }
}
