// A test seam shared by both sides of the photo pool: a gate in shared memory that holds a task
// in its thread (Atomics.wait) until released, and counts the tasks it holds. Nothing passes one
// in production; the integration tests use it to look at the database while a task is running.

const HELD = 0;
const RELEASED = 1;

export type HoldGate = Int32Array;

export function newHoldGate(): HoldGate {
  return new Int32Array(new SharedArrayBuffer(2 * Int32Array.BYTES_PER_ELEMENT));
}

/** In the pool's thread: count this task as held, then wait until the gate opens. */
export function waitAtGate(gate: HoldGate): void {
  Atomics.add(gate, HELD, 1);
  Atomics.notify(gate, HELD);
  while (Atomics.load(gate, RELEASED) === 0) Atomics.wait(gate, RELEASED, 0);
}

/** In the calling thread: resolves once at least `count` tasks are waiting at the gate. */
export async function heldAtGate(gate: HoldGate, count: number): Promise<void> {
  for (let held = Atomics.load(gate, HELD); held < count; held = Atomics.load(gate, HELD)) {
    await Atomics.waitAsync(gate, HELD, held).value;
  }
}

/** How many tasks have reached the gate so far. */
export function countAtGate(gate: HoldGate): number {
  return Atomics.load(gate, HELD);
}

export function openGate(gate: HoldGate): void {
  Atomics.store(gate, RELEASED, 1);
  Atomics.notify(gate, RELEASED);
}
