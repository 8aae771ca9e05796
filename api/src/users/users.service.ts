import { ConflictException, Inject, Injectable, NotFoundException } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { CreateInvitationRequest, Invitation as InvitationDto, UpdateUserRequest, User as UserDto } from '@shuntwise/contracts';
import { Sequelize } from 'sequelize-typescript';
import { hashToken, newToken } from '../auth/auth.service';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { ENV, publicUrl, type Env } from '../config/env';
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
    @InjectConnection() private readonly sequelize: Sequelize,
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
    const invitation = await this.sequelize.transaction(async (transaction) => {
      const created = await this.users.createInvitation(
        { email: request.email, name: request.name, role: request.role, tokenHash: hashToken(token), invitedById: admin.id, expiresAt },
        transaction,
      );
      const link = `${publicUrl(this.env)}/invitation/${token}`;
      await this.mail.enqueue(
        {
          to: [request.email],
          subject: 'You are invited to Shuntwise',
          kind: 'invitation',
          body: [
            `Hello ${request.name},`,
            '',
            `${admin.name} has invited you to Shuntwise as ${request.role}.`,
            `Set your password here (the link works once and expires ${expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC):`,
            '',
            link,
          ].join('\n'),
        },
        transaction,
      );
      return created;
    });
    return toInvitationDto(invitation);
  }

  /** Role change and deactivation end the user's tokens; an admin cannot lock themselves out. */
  async update(id: number, request: UpdateUserRequest, admin: AuthUser): Promise<UserDto> {
    const user = await this.users.findById(id);
    if (!user) throw new NotFoundException(`No user with id ${id}`);
    if (id === admin.id && (request.active === false || (request.role && request.role !== 'admin'))) {
      throw new ConflictException('You cannot deactivate yourself or take away your own admin role');
    }
    const endsTokens = (request.role !== undefined && request.role !== user.role) || (request.active === false && user.active);
    await user.update({ ...request, tokenVersion: endsTokens ? user.tokenVersion + 1 : user.tokenVersion });
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
    createdAt: invitation.createdAt.toISOString(),
  };
}
