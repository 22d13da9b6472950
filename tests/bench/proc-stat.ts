// CPU accounting from Linux's /proc for the benchmarks, in ms (clock ticks of 10 ms).
import { readFileSync } from 'node:fs';

const TICK_MS = 10;

/** CPU time (user + system) a process has used so far. */
export function cpuMs(pid: number): number {
  // Fields 14 and 15 of /proc/PID/stat, counted after the command name in parentheses.
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return (Number(fields[11]) + Number(fields[12])) * TICK_MS;
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
