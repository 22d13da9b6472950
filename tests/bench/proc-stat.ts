// CPU accounting from Linux's /proc for the benchmarks, in ms (clock ticks of 10 ms).
import { readdirSync, readFileSync } from 'node:fs';

const TICK_MS = 10;

/** The fields of /proc/PID/stat after the command name in parentheses (so field 3, the state, is [0]). */
const statFields = (pid: number | string) => readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');

/** CPU time (user + system) a process has used so far. */
export function cpuMs(pid: number): number {
  // Fields 14 and 15: utime and stime.
  const fields = statFields(pid);
  return (Number(fields[11]) + Number(fields[12])) * TICK_MS;
}

/** The live processes whose parent is `pid` (field 4 of their stat). */
export function childPids(pid: number): number[] {
  return readdirSync('/proc').filter((d) => /^\d+$/.test(d)).flatMap((d) => {
    try {
      return Number(statFields(d)[1]) === pid ? [Number(d)] : [];
    } catch {
      return []; // gone meanwhile
    }
  });
}

/** CPU time a process and its children (the workers of a server run as several) have used so far. */
export function treeCpuMs(pid: number): number {
  return childPids(pid).reduce((sum, child) => sum + cpuMs(child), cpuMs(pid));
}

/**
 * CPU time the hypervisor gave to other guests while this machine wanted it ("steal"), over all
 * CPUs so far. On a shared virtual machine it explains slow runs that nothing in the guest caused.
 */
export function stolenMs(): number {
  return machineCpu()[7] * TICK_MS;
}

/** CPU time no process wanted (idle, over all CPUs so far): near zero means the machine was the limit. */
export function idleMs(): number {
  return machineCpu()[3] * TICK_MS;
}

/** The first line of /proc/stat: user nice system idle iowait irq softirq steal …, in ticks. */
function machineCpu(): number[] {
  return readFileSync('/proc/stat', 'utf8').split('\n')[0].trim().split(/\s+/).slice(1).map(Number);
}
