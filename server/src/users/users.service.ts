import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import type { CreateUserRequest, Role, SessionUser, UpdateUserRequest, UserView } from '@stormhour/shared';
import { AuditService } from '../audit/audit.service.js';
import { RegionsRepository } from '../regions/regions.repository.js';
import { hashPassword } from './passwords.js';
import { type UserRow, UsersRepository } from './users.repository.js';

export function toUserView(u: UserRow): UserView {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    districtId: u.districtId,
    active: u.active,
    createdAt: u.createdAt.toISOString(),
    lastSignInAt: u.lastSignInAt?.toISOString() ?? null,
  };
}

@Injectable()
export class UsersService {
  constructor(
    private readonly users: UsersRepository,
    private readonly regions: RegionsRepository,
    private readonly audit: AuditService,
  ) {}

  async list(filter: { q?: string; role?: Role }): Promise<UserView[]> {
    return (await this.users.list(filter)).map(toUserView);
  }

  async create(actor: SessionUser, req: CreateUserRequest): Promise<UserView> {
    if (await this.users.findByEmail(req.email)) {
      throw new ConflictException({
        message: `A person with the e-mail ${req.email} already exists.`,
        details: [{ where: 'email', problem: 'already in use' }],
      });
    }
    const districtId = req.role === 'officer' ? await this.checkDistrict(req.districtId) : null;
    const passwordHash = await hashPassword(req.password);
    return this.users.transaction(async (tx) => {
      const row = await this.users.insert(
        { email: req.email, name: req.name, role: req.role, districtId, passwordHash },
        tx,
      );
      await this.audit.record(
        actor,
        'user.create',
        `user:${row.id}`,
        { email: row.email, role: row.role },
        tx,
      );
      return toUserView(row);
    });
  }

  async update(actor: SessionUser, id: number, req: UpdateUserRequest): Promise<UserView> {
    const current = await this.users.findById(id);
    if (!current) throw new NotFoundException(`There is no person with id ${id}.`);
    if (actor.id === id && (req.active === false || (req.role && req.role !== current.role))) {
      throw new BadRequestException({
        message: 'You cannot deactivate yourself or change your own role; ask another administrator.',
        details: [
          { where: req.active === false ? 'active' : 'role', problem: 'not allowed on your own account' },
        ],
      });
    }
    const role = req.role ?? current.role;
    let districtId = req.districtId === undefined ? current.districtId : req.districtId;
    if (role === 'officer') districtId = await this.checkDistrict(districtId);
    else districtId = null;

    return this.users.transaction(async (tx) => {
      const updated = await this.users.update(
        id,
        { name: req.name ?? current.name, role, districtId, active: req.active ?? current.active },
        tx,
      );
      // A role change or deactivation must take effect at once, not when the token expires.
      if (req.active === false || role !== current.role) await this.users.bumpTokenVersion(id, tx);
      const action =
        req.active === false
          ? 'user.deactivate'
          : req.active === true && !current.active
            ? 'user.reactivate'
            : 'user.update';
      await this.audit.record(actor, action, `user:${id}`, { ...req }, tx);
      return toUserView(updated);
    });
  }

  private async checkDistrict(districtId: number | null | undefined): Promise<number> {
    if (districtId === null || districtId === undefined) {
      throw new BadRequestException({
        message: 'An extension officer must be assigned to a district.',
        details: [{ where: 'districtId', problem: 'required for an officer' }],
      });
    }
    if (!(await this.regions.findDistrict(districtId))) {
      throw new BadRequestException({
        message: `There is no district with id ${districtId}.`,
        details: [{ where: 'districtId', problem: 'no such district' }],
      });
    }
    return districtId;
  }
}
