import type { LoginResponse, SessionUser } from '@stormhour/shared';
import { useQueryClient } from '@tanstack/react-query';
import { createContext, type ReactNode, useCallback, useContext, useEffect, useMemo, useState } from 'react';
import { api } from '../config/paths';
import { refreshSession, request, setAccessToken, setSessionHandlers } from './api';

interface AuthContextValue {
  /** The signed-in person, or null. */
  user: SessionUser | null;
  /** True while the app asks the server whether a session cookie is still valid. */
  restoring: boolean;
  signIn: (email: string, password: string) => Promise<SessionUser>;
  signOut: () => Promise<void>;
}

const AuthContext = createContext<AuthContextValue | null>(null);

export function AuthProvider({ children }: { children: ReactNode }) {
  const queryClient = useQueryClient();
  const [user, setUser] = useState<SessionUser | null>(null);
  const [restoring, setRestoring] = useState(true);

  const forget = useCallback(() => {
    setAccessToken(null);
    setUser(null);
    // Another person may sign in next on this browser: drop everything cached for this one.
    queryClient.clear();
  }, [queryClient]);

  useEffect(() => {
    setSessionHandlers({ onRefreshed: (session) => setUser(session.user), onLost: forget });
    let cancelled = false;
    // A reload loses the in-memory token; the refresh cookie may still hold a session.
    refreshSession().then((session) => {
      if (cancelled) return;
      setUser(session?.user ?? null);
      setRestoring(false);
    });
    return () => {
      cancelled = true;
    };
  }, [forget]);

  const signIn = useCallback(async (email: string, password: string) => {
    const session = await request<LoginResponse>(api.login, {
      method: 'POST',
      body: { email, password },
      retryOn401: false,
      credentials: 'include',
    });
    setAccessToken(session.accessToken);
    setUser(session.user);
    return session.user;
  }, []);

  const signOut = useCallback(async () => {
    try {
      await request<void>(api.logout, { method: 'POST', retryOn401: false, credentials: 'include' });
    } catch {
      // Signing out locally matters more than telling the server; its cookie expires anyway.
    }
    forget();
  }, [forget]);

  const value = useMemo(() => ({ user, restoring, signIn, signOut }), [user, restoring, signIn, signOut]);
  return <AuthContext.Provider value={value}>{children}</AuthContext.Provider>;
}

export function useAuth(): AuthContextValue {
  const value = useContext(AuthContext);
  if (!value) throw new Error('useAuth needs an AuthProvider above it');
  return value;
}

/** The signed-in user, for screens that only render inside the session guard. */
export function useSessionUser(): SessionUser {
  const { user } = useAuth();
  if (!user) throw new Error('useSessionUser used outside a signed-in route');
  return user;
}
