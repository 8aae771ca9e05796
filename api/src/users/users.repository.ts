import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Role } from '@shuntwise/contracts';
import { Op, type Transaction } from 'sequelize';
import { RawRows } from '../database/raw-rows';
import { Invitation } from './invitation.model';
import { User } from './user.model';

/** The only place that queries users and invitations. */
@Injectable()
export class UsersRepository {
  constructor(
    @InjectModel(User) private readonly users: typeof User,
    @InjectModel(Invitation) private readonly invitations: typeof Invitation,
    private readonly raw: RawRows,
  ) {}

  /**
   * What every authenticated request checks its token against, read fresh from the row each
   * time (one primary-key read, no model instance): logout and deactivation end a token at
   * once on every replica, with no cache to expire.
   */
  async tokenHolder(id: number): Promise<{ id: number; email: string; name: string; role: Role; active: boolean; tokenVersion: number } | null> {
    const [row] = await this.raw.select<{ id: number; email: string; name: string; role: Role; active: number; tokenVersion: number }>(
      'SELECT id, email, name, role, active, token_version AS tokenVersion FROM users WHERE id = ?',
      [id],
    );
    return row ? { id: row.id, email: row.email, name: row.name, role: row.role, active: Boolean(row.active), tokenVersion: row.tokenVersion } : null;
  }

  findById(id: number, transaction?: Transaction): Promise<User | null> {
    return this.users.findByPk(id, { transaction });
  }

  findByEmail(email: string, transaction?: Transaction): Promise<User | null> {
    return this.users.findOne({ where: { email: email.toLowerCase() }, transaction });
  }

  list(): Promise<User[]> {
    return this.users.findAll({ order: [['name', 'ASC']] });
  }

  listByRole(role: User['role']): Promise<User[]> {
    return this.users.findAll({ where: { role, active: true }, order: [['name', 'ASC']] });
  }

  create(values: Pick<User, 'email' | 'name' | 'role'> & { passwordHash: string | null }, transaction?: Transaction): Promise<User> {
    return this.users.create({ ...values, email: values.email.toLowerCase() }, { transaction });
  }

  /** Writes the given columns of a user (the instance is updated too). */
  async saveUser(
    user: User,
    values: Partial<Pick<User, 'name' | 'role' | 'active' | 'passwordHash' | 'tokenVersion' | 'lastLoginAt'>>,
    transaction?: Transaction,
  ): Promise<User> {
    return user.update(values, { transaction });
  }

  /** Ends every token the user holds: the token version goes up by one in the row itself. */
  async endTokens(id: number): Promise<void> {
    await this.users.increment('tokenVersion', { where: { id } });
  }

  listInvitations(): Promise<Invitation[]> {
    return this.invitations.findAll({ order: [['createdAt', 'DESC']] });
  }

  findInvitationById(id: number, transaction?: Transaction): Promise<Invitation | null> {
    return this.invitations.findByPk(id, { transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  }

  findInvitationByHash(tokenHash: string, transaction?: Transaction): Promise<Invitation | null> {
    return this.invitations.findOne({ where: { tokenHash }, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  }

  /** Writes the given columns of an invitation (the instance is updated too). */
  async saveInvitation(
    invitation: Invitation,
    values: Partial<Pick<Invitation, 'tokenHash' | 'expiresAt' | 'acceptedAt' | 'revokedAt'>>,
    transaction?: Transaction,
  ): Promise<Invitation> {
    return invitation.update(values, { transaction });
  }

  /** E-mails of the active engineers except one (who should hear of a case or request waiting for review). */
  async activeEngineerEmails(exceptId: number, transaction?: Transaction): Promise<string[]> {
    const rows = await this.users.findAll({
      attributes: ['email'],
      where: { role: 'engineer', active: true, id: { [Op.ne]: exceptId } },
      order: [['email', 'ASC']],
      transaction,
    });
    return rows.map((r) => r.email);
  }

  createInvitation(
    values: Pick<Invitation, 'email' | 'name' | 'role' | 'tokenHash' | 'invitedById' | 'expiresAt'>,
    transaction?: Transaction,
  ): Promise<Invitation> {
    return this.invitations.create({ ...values }, { transaction });
  }
}
