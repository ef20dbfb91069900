export function findPgBin(): string | null;
export function ensurePgInstalled(log?: (m: string) => void): string;
export function portOpen(port: number): Promise<boolean>;
export function freePort(): Promise<number>;
export function startCluster(opts: { dataDir: string; port: number; user?: string; password?: string; database?: string; log?: (m: string) => void }): Promise<string>;
export function stopCluster(dataDir: string): boolean;
export function makeTempClusterDir(prefix: string): string;
