// Types of staticServer.mjs for the TypeScript tests.
export function startStaticServer(folder: string, options?: { host?: string; port?: number }): Promise<{ url: string; close(): Promise<void> }>;
