/** The part of the platform's TextDecoder that ingestion uses. */
export interface Utf8Decoder {
  decode(bytes: Uint8Array): string;
}

type DecoderConstructor = new (label: string, options?: { fatal?: boolean }) => Utf8Decoder;

/**
 * A UTF-8 decoder of the platform: `TextDecoder` is a global of browsers, workers and Node (since
 * 11), but the ES2022 library types the packages build with do not declare it, so it is reached
 * through `globalThis` with only the member we call. `fatal` throws on invalid UTF-8 instead of
 * writing U+FFFD.
 */
export function utf8Decoder(fatal: boolean): Utf8Decoder {
  const Decoder = (globalThis as unknown as { TextDecoder: DecoderConstructor }).TextDecoder;
  return new Decoder('utf-8', { fatal });
}
