import { z } from 'zod';
import { NewPassword } from './auth.js';
import { ROLES } from './roles.js';

export const UserView = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  districtId: z.number().int().nullable(),
  active: z.boolean(),
  createdAt: z.string(),
  lastSignInAt: z.string().nullable(),
});
export type UserView = z.infer<typeof UserView>;

const officerNeedsDistrict = (u: { role?: string; districtId?: number | null }) =>
  u.role !== 'officer' || (u.districtId !== null && u.districtId !== undefined);
const districtMessage = {
  message: 'An extension officer must be assigned to a district',
  path: ['districtId'],
};

export const CreateUserRequest = z
  .object({
    email: z.string().trim().toLowerCase().email('Enter a valid e-mail address'),
    name: z.string().trim().min(1, 'Enter the person’s name').max(120),
    role: z.enum(ROLES, { message: `Role must be one of ${ROLES.join(', ')}` }),
    districtId: z.number().int().positive().nullable().default(null),
    password: NewPassword,
  })
  .refine(officerNeedsDistrict, districtMessage);
export type CreateUserRequest = z.infer<typeof CreateUserRequest>;

export const UpdateUserRequest = z
  .object({
    name: z.string().trim().min(1, 'Enter the person’s name').max(120).optional(),
    role: z.enum(ROLES, { message: `Role must be one of ${ROLES.join(', ')}` }).optional(),
    districtId: z.number().int().positive().nullable().optional(),
    active: z.boolean().optional(),
  })
  .strict();
export type UpdateUserRequest = z.infer<typeof UpdateUserRequest>;
