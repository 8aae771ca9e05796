import { createHash, randomBytes } from 'node:crypto';
import { Inject, Injectable, NotFoundException, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { AcceptInvitationRequest, LoginRequest, LoginResponse, UserSummary } from '@shuntwise/contracts';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { ENV, type Env } from '../config/env';
import { UnitOfWork } from '../database/unit-of-work';
import type { User } from '../users/user.model';
import { UsersRepository } from '../users/users.repository';
import type { JwtPayload } from './jwt.strategy';
import { hashPassword, verifyPassword } from './passwords';

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');
export const newToken = () => randomBytes(32).toString('base64url');

const BAD_CREDENTIALS = 'E-mail or password is wrong';

@Injectable()
export class AuthService {
  constructor(
    @Inject(ENV) private readonly env: Env,
    private readonly users: UsersRepository,
    private readonly jwt: JwtService,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  /** Unknown e-mail, inactive user and wrong password all give the same 401 in the same time. */
  async login({ email, password }: LoginRequest): Promise<LoginResponse> {
    const user = await this.users.findByEmail(email);
    const ok = await verifyPassword(user?.passwordHash, password);
    if (!user || !ok || !user.active) throw new UnauthorizedException(BAD_CREDENTIALS);
    await this.users.saveUser(user, { lastLoginAt: new Date() });
    return this.issue(user);
  }

  /** Ends every token the user holds (all devices). */
  async logout(userId: number): Promise<void> {
    await this.users.endTokens(userId);
  }

  /** The signed-in user as the token check read it from the users row in this very request: no second read. */
  me(user: AuthUser): UserSummary {
    return { id: user.id, email: user.email, name: user.name, role: user.role };
  }

  async findInvitation(token: string) {
    const invitation = await this.users.findInvitationByHash(hashToken(token));
    if (!invitation || invitation.acceptedAt || invitation.revokedAt || invitation.expiresAt.getTime() < Date.now()) {
      throw new NotFoundException('This invitation is unknown, already used or expired; ask an admin for a new one');
    }
    return { email: invitation.email, name: invitation.name, role: invitation.role, expiresAt: invitation.expiresAt.toISOString() };
  }

  /** Single use: the invitation row is locked, checked and marked accepted in one transaction. */
  async acceptInvitation(request: AcceptInvitationRequest): Promise<LoginResponse> {
    const passwordHash = await hashPassword(request.password);
    const user = await this.unitOfWork.run(async (transaction) => {
      const invitation = await this.users.findInvitationByHash(hashToken(request.token), transaction);
      if (!invitation || invitation.acceptedAt || invitation.revokedAt || invitation.expiresAt.getTime() < Date.now()) {
        throw new NotFoundException('This invitation is unknown, already used or expired; ask an admin for a new one');
      }
      await this.users.saveInvitation(invitation, { acceptedAt: new Date() }, transaction);
      const existing = await this.users.findByEmail(invitation.email, transaction);
      if (existing) {
        // Re-invited person (e.g. never finished before): set the password, keep the id.
        return this.users.saveUser(
          existing,
          { name: request.name, passwordHash, role: invitation.role, active: true, tokenVersion: existing.tokenVersion + 1 },
          transaction,
        );
      }
      return this.users.create({ email: invitation.email, name: request.name, role: invitation.role, passwordHash }, transaction);
    });
    await this.users.saveUser(user, { lastLoginAt: new Date() });
    return this.issue(user);
  }

  private async issue(user: User): Promise<LoginResponse> {
    const payload: JwtPayload = { sub: user.id, role: user.role, tv: user.tokenVersion };
    const accessToken = await this.jwt.signAsync(payload);
    return { accessToken, user: summary(user) };
  }
}

export function summary(user: User): UserSummary {
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}
