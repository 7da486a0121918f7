import type { UseQueryResult } from '@tanstack/react-query';
import type { ParsedToolInput } from '@splitcase/contracts';
import { useEffect, useState } from 'react';
import { ApiError } from '@/lib/api-client';

export interface ToolResultState<T> {
  /** The last answer the server gave for valid inputs (kept while a new one is on its way or inputs are wrong). */
  result: T | undefined;
  /** The inputs changed since that answer: it is shown dimmed. */
  outdated: boolean;
  busy: boolean;
  fieldErrors: Record<string, string>;
  /** What the server read from each typed field (also on a 400, for the fields that parsed). */
  parsed: Record<string, ParsedToolInput>;
  /** A message that names no field (422 from the calculation, network…). */
  message: string | null;
}

/** Keeps the last good result of a live tool call and splits its errors into field messages and one message. */
export function useToolResult<T extends object>(query: UseQueryResult<T>, active: boolean): ToolResultState<T> {
  const [last, setLast] = useState<T | undefined>(undefined);
  const fresh = query.data !== undefined && !query.isPlaceholderData && !query.isError;
  useEffect(() => {
    if (fresh) setLast(query.data);
  }, [fresh, query.data]);
  useEffect(() => {
    if (!active) setLast(undefined);
  }, [active]);
  const error = query.error;
  const api = error instanceof ApiError ? error : null;
  const fieldErrors = api?.status === 400 ? api.fields : {};
  const errorParsed = api?.status === 400 ? ((api.details as { parsed?: Record<string, ParsedToolInput> } | undefined)?.parsed ?? {}) : {};
  const message = error && Object.keys(fieldErrors).length === 0 ? error.message : null;
  return {
    result: active ? last : undefined,
    outdated: active && (query.isError || query.isFetching || !fresh),
    busy: active && query.isFetching,
    fieldErrors,
    parsed: error ? errorParsed : ((query.data as { parsed?: Record<string, ParsedToolInput> } | undefined)?.parsed ?? {}),
    message,
  };
}

/** The request body from typed fields: blank fields are left out. */
export function filledFields<K extends string>(fields: Record<K, string>): Partial<Record<K, string>> {
  const out: Partial<Record<K, string>> = {};
  for (const [k, v] of Object.entries(fields) as [K, string][]) if (v.trim() !== '') out[k] = v.trim();
  return out;
}
