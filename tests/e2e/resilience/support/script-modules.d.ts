// Types for the orchestration modules (plain JavaScript in scripts/lib) that these tests reuse.

declare module "@/scripts/lib/postgres.mjs" {
  export interface ClusterOptions {
    /** Folder of the cluster: data/, socket/ and server.log go inside. */
    root: string;
    port: number;
    password: string;
    /** fsync off: for test data only. */
    throwaway?: boolean;
  }

  /** A PostgreSQL cluster run as the `postgres` user on 127.0.0.1 (Debian's server binaries). */
  export class Cluster {
    constructor(options: ClusterOptions);
    readonly root: string;
    readonly port: number;
    readonly logFile: string;
    readonly isRunning: boolean;
    initialize(): boolean;
    start(): void;
    /** Fast shutdown: open transactions roll back, connections are closed. */
    stop(): void;
    ensureDatabase(name: string): boolean;
    url(database: string): string;
  }
}

declare module "@/scripts/lib/ports.mjs" {
  /** A TCP port on 127.0.0.1 that nothing listens on right now. */
  export function freePort(): Promise<number>;
  /** Polls `url` until it answers `expectStatus` (200), or throws after `timeoutMs`. */
  export function waitForHttp(url: string, options?: { timeoutMs?: number; expectStatus?: number }): Promise<void>;
}

declare module "@/scripts/lib/proc.mjs" {
  /** A process's state letter, parent's pid and CPU time (ms) from /proc/<pid>/stat; undefined once it has exited. */
  export function processStat(pid: number | string): { state: string; parentPid: number; cpuMs: number } | undefined;
  /** The pids of the children of `pid` that are alive (zombies, exited but not yet reaped, left out). */
  export function childPids(pid: number): number[];
}
