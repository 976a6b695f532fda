import { deserialize, serialize } from 'node:v8';

/**
 * Lab tasks and their results carry typed arrays and nested records that JSON would flatten:
 * they travel through Redis as V8's structured-clone bytes (what worker threads receive), base64 in a string.
 */
export function encodePayload(value: unknown): string {
  return serialize(value).toString('base64');
}

export function decodePayload<T>(text: string): T {
  return deserialize(Buffer.from(text, 'base64')) as T;
}
