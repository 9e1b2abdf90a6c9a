import { invalidParam, missingParam } from './errors.ts';
import type { FormObject, FormValue } from './form-body.ts';
import type { FakeState } from './state.ts';

export interface FakeConfig {
  /** Where the fake's hosted pages are reached from a browser (http://127.0.0.1:12111). */
  publicUrl: string;
}

export interface ApiContext {
  /** 'platform' or the connected account named by the Stripe-Account header. */
  account: string;
  body: FormObject;
  query: FormObject;
  params: string[];
  state: FakeState;
  config: FakeConfig;
}

export interface ApiRoute {
  method: 'GET' | 'POST' | 'DELETE';
  pattern: RegExp;
  /** Answered for the platform only (a Stripe-Account header is refused). */
  platformOnly?: boolean;
  handle(ctx: ApiContext): unknown;
}

export type PageAnswer = { status?: number; html: string } | { redirect: string };

export interface PageContext {
  method: string;
  params: string[];
  form: FormObject;
  state: FakeState;
  config: FakeConfig;
}

export interface PageRoute {
  pattern: RegExp;
  handle(ctx: PageContext): PageAnswer;
}

export function optionalString(object: FormObject, key: string): string | undefined {
  const value = object[key];
  if (value === undefined) return undefined;
  if (typeof value !== 'string') throw invalidParam(key, `Invalid string: ${key}`);
  return value;
}

export function requiredString(object: FormObject, key: string, param = key): string {
  const value = optionalString(object, key);
  if (value === undefined || value === '') throw missingParam(param);
  return value;
}

export function optionalInteger(object: FormObject, key: string, param = key): number | undefined {
  const value = optionalString(object, key);
  if (value === undefined) return undefined;
  if (!/^-?\d+$/.test(value)) throw invalidParam(param, `Invalid integer: ${value}`);
  return Number(value);
}

export function optionalObject(object: FormObject, key: string): FormObject | undefined {
  const value = object[key];
  if (value === undefined || value === '') return undefined;
  if (typeof value === 'string' || Array.isArray(value)) throw invalidParam(key, `Invalid hash: ${key}`);
  return value;
}

export function optionalArray(object: FormObject, key: string): FormValue[] | undefined {
  const value = object[key];
  if (value === undefined) return undefined;
  if (!Array.isArray(value)) throw invalidParam(key, `Invalid array: ${key}`);
  return value;
}

/** metadata[key]=value pairs: strings only, as the hosted service keeps them. */
export function metadataOf(object: FormObject): Record<string, string> {
  const metadata = optionalObject(object, 'metadata') ?? {};
  const out: Record<string, string> = {};
  for (const [key, value] of Object.entries(metadata)) {
    if (typeof value !== 'string') throw invalidParam(`metadata[${key}]`, 'Metadata values must be strings.');
    out[key] = value;
  }
  return out;
}

export function listOf<T>(
  url: string,
  data: T[],
  limit = 10,
): { object: 'list'; data: T[]; has_more: boolean; url: string } {
  return { object: 'list', data: data.slice(0, limit), has_more: data.length > limit, url };
}
