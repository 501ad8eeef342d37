/**
 * A sightline's crew: who is in it with which role, role changes, removal, leaving and handing
 * the sightline over. Access is checked with the policy table (access-policy.ts).
 */
import type { Sequelize } from 'sequelize';
import type { CrewRole } from '../../shared/policy/sightline-policy';
import type { CrewMember, CrewResponse } from '../../shared/schemas/crew';
import { AppError } from '../errors';
import { CrewInviteModel } from '../models/crew-invite';
import { CrewMemberModel } from '../models/crew-member';
import { UserModel } from '../models/user';
import { WatchModel } from '../models/watch';
import type { SightlineService } from './sightline-service';

const userInclude = [{ model: UserModel, as: 'user', attributes: ['id', 'name', 'email'] }];

export class CrewService {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly sightlines: SightlineService,
    private readonly clock: () => Date = () => new Date(),
  ) {}

  /** The owner and the crew (owner first, then by name); pending and past invites for the owner only. */
  async get(user: UserModel, sightlineId: string): Promise<CrewResponse> {
    const sightline = await this.sightlines.get(user, sightlineId, 'read');
    const role = sightline.viewerRole!;
    const showEmail = role === 'owner';
    const members = await CrewMemberModel.findAll({ where: { sightlineId }, include: userInclude });
    const owner = await UserModel.findByPk(sightline.ownerId);
    const list: CrewMember[] = [
      { userId: sightline.ownerId, name: owner?.name ?? '', email: showEmail ? owner?.email ?? null : null, role: 'owner', since: sightline.createdAt.toISOString() },
      ...members
        .map((m) => ({ userId: m.userId, name: m.user?.name ?? '', email: showEmail ? m.user?.email ?? null : null, role: m.role, since: m.createdAt.toISOString() }))
        .sort((a, b) => a.name.localeCompare(b.name)),
    ];
    const now = this.clock();
    const invites = role === 'owner'
      ? (await CrewInviteModel.findAll({
        where: { sightlineId },
        include: [{ model: UserModel, as: 'inviter', attributes: ['id', 'name'] }],
        order: [['createdAt', 'DESC']],
        limit: 100,
      })).map((i) => i.toPublic(now))
      : [];
    return { myRole: role, members: list, invites };
  }

  /** The owner changes a member's role. */
  async changeRole(user: UserModel, sightlineId: string, memberId: string, role: CrewRole): Promise<void> {
    await this.sequelize.transaction(async (transaction) => {
      await this.sightlines.get(user, sightlineId, 'manage-crew', transaction);
      const member = await CrewMemberModel.findOne({ where: { sightlineId, userId: memberId }, transaction });
      if (!member) throw AppError.notFound('That person is not in the crew');
      await member.update({ role }, { transaction });
    });
  }

  /**
   * Removes a member: the owner may remove anyone in the crew; a member may remove themselves
   * (leave). The owner cannot leave (hand the sightline over first). The member's watches on the
   * sightline are deleted with the membership (their deliveries cascade).
   */
  async remove(user: UserModel, sightlineId: string, memberId: string): Promise<void> {
    await this.sequelize.transaction(async (transaction) => {
      const action = memberId === user.id ? 'leave' : 'manage-crew';
      await this.sightlines.get(user, sightlineId, action, transaction);
      const removed = await CrewMemberModel.destroy({ where: { sightlineId, userId: memberId }, transaction });
      if (removed === 0) throw AppError.notFound('That person is not in the crew');
      // Their watches on it go too: they can no longer see the sightline, so its e-mails must stop.
      await WatchModel.destroy({ where: { sightlineId, ownerId: memberId }, transaction });
    });
  }

  /**
   * Hands the sightline to a crew member: they become the owner, the old owner stays as an editor.
   * Done under a lock of the sightline row, so two hand-overs cannot cross.
   */
  async handOver(user: UserModel, sightlineId: string, newOwnerId: string): Promise<void> {
    await this.sequelize.transaction(async (transaction) => {
      const sightline = await this.sightlines.get(user, sightlineId, 'manage-crew', transaction);
      if (newOwnerId === sightline.ownerId) throw new AppError('validation', 'You own this sightline already', { userId: 'Choose another crew member' });
      const member = await CrewMemberModel.findOne({ where: { sightlineId, userId: newOwnerId }, transaction });
      if (!member) throw new AppError('validation', 'Only a crew member can take the sightline over', { userId: 'Choose a crew member' });
      await member.destroy({ transaction });
      await CrewMemberModel.create({ sightlineId, userId: sightline.ownerId, role: 'editor' }, { transaction });
      await sightline.update({ ownerId: newOwnerId }, { transaction });
    });
  }
}
