import type { CreateUserRequest, Role, UpdateUserRequest, UserView } from '@stormhour/shared';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../config/paths';
import { request } from '../../../lib/api';
import { withQuery } from '../../../lib/queryString';

export interface UserListParams {
  q?: string;
  role?: Role;
}

const usersKey = (params: UserListParams) => ['users', params] as const;

export function fetchUsers(params: UserListParams = {}): Promise<UserView[]> {
  return request<UserView[]>(withQuery(api.users, { q: params.q, role: params.role }));
}
export function getUsersQueryOptions(params: UserListParams = {}) {
  return queryOptions({ queryKey: usersKey(params), queryFn: () => fetchUsers(params) });
}
export function useUsers(params: UserListParams = {}) {
  return useQuery(getUsersQueryOptions(params));
}

export function createUser(body: CreateUserRequest): Promise<UserView> {
  return request<UserView>(api.users, { method: 'POST', body });
}
export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['users'] }),
  });
}

export function updateUser(id: number, body: UpdateUserRequest): Promise<UserView> {
  return request<UserView>(api.user(id), { method: 'PATCH', body });
}
export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: UpdateUserRequest }) => updateUser(id, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['users'] }),
  });
}
