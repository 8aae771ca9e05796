import { ConflictException, ForbiddenException, Injectable, NotFoundException, UnprocessableEntityException } from '@nestjs/common';
import type { HousePartBuyer as HousePartBuyerDto } from '@shuntwise/contracts';
import { UniqueConstraintError } from 'sequelize';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { UsersRepository } from '../users/users.repository';
import { HousePartsRepository } from '../house-parts/house-parts.repository';
import type { HousePartBuyer } from './house-part-buyer.model';
import { HousePartBuyersRepository } from './house-part-buyers.repository';

/**
 * Which buyers follow a house part: they are mailed when one of its sources is cleared,
 * cleared with conditions or revoked. Engineers and admins link any buyer; a buyer links
 * or unlinks only themself.
 */
@Injectable()
export class HousePartBuyersService {
  constructor(
    private readonly buyers: HousePartBuyersRepository,
    private readonly users: UsersRepository,
    private readonly houseParts: HousePartsRepository,
  ) {}

  async list(housePartId: number): Promise<HousePartBuyerDto[]> {
    await this.housePart(housePartId);
    return (await this.buyers.list(housePartId)).map(toDto);
  }

  async add(housePartId: number, userId: number, user: AuthUser): Promise<HousePartBuyerDto> {
    onlySelf(userId, user, 'add');
    const part = await this.housePart(housePartId);
    const buyer = await this.users.findById(userId);
    if (!buyer || buyer.role !== 'buyer' || !buyer.active) {
      throw new UnprocessableEntityException({
        message: `User ${userId} is not an active buyer`,
        errors: [{ path: 'userId', message: 'must be an active buyer' }],
      });
    }
    try {
      await this.buyers.add({ housePartId, userId, addedById: user.id });
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw new ConflictException(`${buyer.name} already follows ${part.partNumber}`);
      throw error;
    }
    return (await this.list(housePartId)).find((b) => b.user.id === userId)!;
  }

  async remove(housePartId: number, userId: number, user: AuthUser): Promise<void> {
    onlySelf(userId, user, 'remove');
    const part = await this.housePart(housePartId);
    const row = await this.buyers.find(housePartId, userId);
    if (!row) throw new NotFoundException(`User ${userId} does not follow ${part.partNumber}`);
    await this.buyers.remove(row);
  }

  private async housePart(id: number) {
    const part = await this.houseParts.findById(id);
    if (!part) throw new NotFoundException(`No house part with id ${id}`);
    return part;
  }
}

function onlySelf(userId: number, user: AuthUser, verb: string): void {
  if (user.role === 'buyer' && userId !== user.id) throw new ForbiddenException(`A buyer may ${verb} only themself as a buyer of a house part`);
}

function toDto(row: HousePartBuyer): HousePartBuyerDto {
  return {
    housePartId: row.housePartId,
    user: { id: row.user!.id, name: row.user!.name, email: row.user!.email },
    addedBy: row.addedBy ? { id: row.addedBy.id, name: row.addedBy.name } : null,
    createdAt: row.createdAt.toISOString(),
  };
}
