import { ConflictException, Inject, Injectable, NotFoundException } from '@nestjs/common';
import type { CreateInvitationRequest, Invitation as InvitationDto, UpdateUserRequest, User as UserDto } from '@shuntwise/contracts';
import type { Transaction } from 'sequelize';
import { hashToken, newToken } from '../auth/auth.service';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { ENV, publicUrl, type Env } from '../config/env';
import { UnitOfWork } from '../database/unit-of-work';
import { MailService } from '../mail/mail.service';
import type { Invitation } from './invitation.model';
import type { User } from './user.model';
import { UsersRepository } from './users.repository';

@Injectable()
export class UsersService {
  constructor(
    @Inject(ENV) private readonly env: Env,
    private readonly users: UsersRepository,
    private readonly mail: MailService,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  async list(): Promise<UserDto[]> {
    return (await this.users.list()).map(toUserDto);
  }

  async listInvitations(): Promise<InvitationDto[]> {
    return (await this.users.listInvitations()).map(toInvitationDto);
  }

  /** Creates the invitation and its mail in one transaction; the link carries a single-use token. */
  async invite(request: CreateInvitationRequest, admin: AuthUser): Promise<InvitationDto> {
    const existing = await this.users.findByEmail(request.email);
    if (existing?.passwordHash) throw new ConflictException(`A user with the e-mail ${request.email} already exists`);
    const token = newToken();
    const expiresAt = new Date(Date.now() + this.env.INVITATION_TTL_HOURS * 3600_000);
    const invitation = await this.unitOfWork.run(async (transaction) => {
      const created = await this.users.createInvitation(
        { email: request.email, name: request.name, role: request.role, tokenHash: hashToken(token), invitedById: admin.id, expiresAt },
        transaction,
      );
      await this.mailInvitation(created, token, admin, transaction);
      return created;
    });
    return toInvitationDto(invitation);
  }

  /**
   * Sends the invitation again with a new link (the old one stops working) and a new
   * expiry; an accepted or revoked invitation cannot be resent.
   */
  async resendInvitation(id: number, admin: AuthUser): Promise<InvitationDto> {
    const invitation = await this.unitOfWork.run(async (transaction) => {
      const row = await this.openInvitation(id, transaction, 'resent');
      const token = newToken();
      await this.users.saveInvitation(
        row,
        { tokenHash: hashToken(token), expiresAt: new Date(Date.now() + this.env.INVITATION_TTL_HOURS * 3600_000) },
        transaction,
      );
      await this.mailInvitation(row, token, admin, transaction);
      return row;
    });
    return toInvitationDto(invitation);
  }

  /** Takes an open invitation back: its link stops working at once. */
  async revokeInvitation(id: number): Promise<InvitationDto> {
    const invitation = await this.unitOfWork.run(async (transaction) => {
      const row = await this.openInvitation(id, transaction, 'revoked');
      await this.users.saveInvitation(row, { revokedAt: new Date() }, transaction);
      return row;
    });
    return toInvitationDto(invitation);
  }

  private async openInvitation(id: number, transaction: Transaction, doing: string): Promise<Invitation> {
    const row = await this.users.findInvitationById(id, transaction);
    if (!row) throw new NotFoundException(`No invitation with id ${id}`);
    if (row.acceptedAt) throw new ConflictException(`The invitation of ${row.email} was accepted; it cannot be ${doing}`);
    if (row.revokedAt) throw new ConflictException(`The invitation of ${row.email} was revoked; invite them again instead`);
    return row;
  }

  private async mailInvitation(invitation: Invitation, token: string, admin: AuthUser, transaction: Transaction): Promise<void> {
    const link = `${publicUrl(this.env)}/invitation/${token}`;
    await this.mail.enqueue(
      {
        to: [invitation.email],
        subject: 'You are invited to Shuntwise',
        kind: 'invitation',
        body: [
          `Hello ${invitation.name},`,
          '',
          `${admin.name} has invited you to Shuntwise as ${invitation.role}.`,
          `Set your password here (the link works once and expires ${invitation.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC):`,
          '',
          link,
        ].join('\n'),
      },
      transaction,
    );
  }

  /** Role change and deactivation end the user's tokens; an admin cannot lock themselves out. */
  async update(id: number, request: UpdateUserRequest, admin: AuthUser): Promise<UserDto> {
    const user = await this.users.findById(id);
    if (!user) throw new NotFoundException(`No user with id ${id}`);
    if (id === admin.id && (request.active === false || (request.role && request.role !== 'admin'))) {
      throw new ConflictException('You cannot deactivate yourself or take away your own admin role');
    }
    const endsTokens = (request.role !== undefined && request.role !== user.role) || (request.active === false && user.active);
    await this.users.saveUser(user, { ...request, tokenVersion: endsTokens ? user.tokenVersion + 1 : user.tokenVersion });
    return toUserDto(user);
  }
}

export function toUserDto(user: User): UserDto {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    active: user.active,
    createdAt: user.createdAt.toISOString(),
    lastLoginAt: user.lastLoginAt ? user.lastLoginAt.toISOString() : null,
  };
}

export function toInvitationDto(invitation: Invitation): InvitationDto {
  return {
    id: invitation.id,
    email: invitation.email,
    name: invitation.name,
    role: invitation.role,
    expiresAt: invitation.expiresAt.toISOString(),
    acceptedAt: invitation.acceptedAt ? invitation.acceptedAt.toISOString() : null,
    revokedAt: invitation.revokedAt ? invitation.revokedAt.toISOString() : null,
    createdAt: invitation.createdAt.toISOString(),
  };
}
