export function findPgBin(): string | null;
export function ensurePgInstalled(log?: (m: string) => void): string;
export function portOpen(port: number): Promise<boolean>;
export function freePort(): Promise<number>;
export function startCluster(opts: {
  dataDir: string;
  port: number;
  user?: string;
  password?: string;
  database?: string;
  log?: (m: string) => void;
  extraOptions?: string;
}): Promise<string>;
export function startStandby(opts: {
  dataDir: string;
  primaryPort: number;
  port: number;
  user?: string;
  password?: string;
  database?: string;
  extraOptions?: string;
}): Promise<string>;
export function stopCluster(dataDir: string): boolean;
export function makeTempClusterDir(prefix: string): string;
export function reachableByPostgres(dir: string): boolean;
export function projectClusterDir(root: string): { dir: string; relocated: boolean };
export function pgRun(bin: string, cmd: string, args: string[], opts?: object): { status: number | null; stdout: string; stderr: string };
