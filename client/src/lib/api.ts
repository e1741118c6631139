import { CSRF_HEADER, type LoginResponse } from '@stormhour/shared';
import { api } from '../config/paths';
import { apiErrorFrom, networkError } from './apiError';

/*
 * The one API client. The access token lives only in this module's memory, never in storage a
 * script could read later; the long-lived refresh token is an httpOnly cookie the server set.
 */
let accessToken: string | null = null;

interface SessionHandlers {
  /** A refresh brought a new token (and perhaps a changed user). */
  onRefreshed: (session: LoginResponse) => void;
  /** The session could not be renewed: the user must sign in again. */
  onLost: () => void;
}
let handlers: SessionHandlers = { onRefreshed: () => {}, onLost: () => {} };

export function setSessionHandlers(next: SessionHandlers): void {
  handlers = next;
}

export function setAccessToken(token: string | null): void {
  accessToken = token;
}

let refreshing: Promise<LoginResponse | null> | null = null;

/** Renews the access token from the refresh cookie. Concurrent callers share one request. */
export function refreshSession(): Promise<LoginResponse | null> {
  refreshing ??= (async () => {
    try {
      const res = await fetch(api.refresh, {
        method: 'POST',
        credentials: 'include',
        headers: { [CSRF_HEADER]: '1' },
      });
      if (!res.ok) {
        accessToken = null;
        return null;
      }
      const session = (await res.json()) as LoginResponse;
      accessToken = session.accessToken;
      handlers.onRefreshed(session);
      return session;
    } catch {
      return null;
    }
  })().finally(() => {
    refreshing = null;
  });
  return refreshing;
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  /** Sent as JSON, or as is when it is FormData. */
  body?: unknown;
  signal?: AbortSignal;
  /** False for calls that must not trigger a refresh on 401 (sign-in itself). */
  retryOn401?: boolean;
  credentials?: RequestCredentials;
}

function headersFor(body: unknown): Record<string, string> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (accessToken) headers.Authorization = `Bearer ${accessToken}`;
  if (body !== undefined && !(body instanceof FormData)) headers['Content-Type'] = 'application/json';
  return headers;
}

async function send(path: string, options: RequestOptions): Promise<Response> {
  const { body } = options;
  try {
    return await fetch(path, {
      method: options.method ?? 'GET',
      headers: headersFor(body),
      body: body === undefined ? undefined : body instanceof FormData ? body : JSON.stringify(body),
      signal: options.signal,
      credentials: options.credentials ?? 'same-origin',
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw networkError();
  }
}

/** Calls the API and returns the parsed JSON (undefined for 204), or throws an ApiError. */
export async function request<T>(path: string, options: RequestOptions = {}): Promise<T> {
  let res = await send(path, options);
  if (res.status === 401 && options.retryOn401 !== false) {
    const renewed = await refreshSession();
    if (renewed) res = await send(path, options);
    if (res.status === 401) handlers.onLost();
  }
  const text = await res.text();
  if (!res.ok) throw apiErrorFrom(res.status, text);
  return (text ? JSON.parse(text) : undefined) as T;
}

/** A GET with the same session handling as request(), answering the raw response. */
async function getRaw(path: string): Promise<Response> {
  let res = await send(path, {});
  if (res.status === 401) {
    const renewed = await refreshSession();
    if (renewed) res = await send(path, {});
    if (res.status === 401) handlers.onLost();
  }
  return res;
}

/** Fetches a file the API serves (downloads need the session header, so a plain link will not do). */
export async function requestBlob(path: string): Promise<Blob> {
  const res = await getRaw(path);
  if (!res.ok) throw apiErrorFrom(res.status, await res.text());
  return res.blob();
}

/** Calls the API for a text answer (a CSV export). */
export async function requestText(path: string): Promise<string> {
  const res = await getRaw(path);
  const text = await res.text();
  if (!res.ok) throw apiErrorFrom(res.status, text);
  return text;
}

/** Hands a fetched file to the browser to save under the given name. */
export function saveBlob(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  document.body.append(link);
  link.click();
  link.remove();
  // Give the download a moment to start before the URL goes.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

interface XhrResult {
  status: number;
  text: string;
}

function sendWithProgress(path: string, form: FormData, onProgress: (fraction: number) => void) {
  return new Promise<XhrResult>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', path);
    xhr.setRequestHeader('Accept', 'application/json');
    if (accessToken) xhr.setRequestHeader('Authorization', `Bearer ${accessToken}`);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => resolve({ status: xhr.status, text: xhr.responseText });
    xhr.onerror = () => reject(networkError());
    xhr.send(form);
  });
}

/**
 * Posts a multipart form, reporting upload progress from 0 to 1 over the whole body.
 * XMLHttpRequest, because fetch cannot report upload progress.
 */
export async function uploadForm<T>(
  path: string,
  form: FormData,
  onProgress: (fraction: number) => void,
): Promise<T> {
  let result = await sendWithProgress(path, form, onProgress);
  if (result.status === 401) {
    const renewed = await refreshSession();
    if (renewed) result = await sendWithProgress(path, form, onProgress);
    if (result.status === 401) handlers.onLost();
  }
  if (result.status < 200 || result.status >= 300) throw apiErrorFrom(result.status, result.text);
  return (result.text ? JSON.parse(result.text) : undefined) as T;
}

/** Uploads one file as multipart field `field`, reporting upload progress from 0 to 1. */
export function uploadFile<T>(
  path: string,
  file: File,
  onProgress: (fraction: number) => void,
  field = 'file',
): Promise<T> {
  const form = new FormData();
  form.append(field, file);
  return uploadForm<T>(path, form, onProgress);
}
