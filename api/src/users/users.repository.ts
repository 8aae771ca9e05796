import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { Invitation } from './invitation.model';
import { User } from './user.model';

/** The only place that queries users and invitations. */
@Injectable()
export class UsersRepository {
  constructor(
    @InjectModel(User) private readonly users: typeof User,
    @InjectModel(Invitation) private readonly invitations: typeof Invitation,
  ) {}

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

  listInvitations(): Promise<Invitation[]> {
    return this.invitations.findAll({ order: [['createdAt', 'DESC']] });
  }

  findInvitationById(id: number, transaction?: Transaction): Promise<Invitation | null> {
    return this.invitations.findByPk(id, { transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  }

  findInvitationByHash(tokenHash: string, transaction?: Transaction): Promise<Invitation | null> {
    return this.invitations.findOne({ where: { tokenHash }, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  }

  createInvitation(values: Pick<Invitation, 'email' | 'name' | 'role' | 'tokenHash' | 'invitedById' | 'expiresAt'>, transaction?: Transaction): Promise<Invitation> {
    return this.invitations.create({ ...values }, { transaction });
  }
}
