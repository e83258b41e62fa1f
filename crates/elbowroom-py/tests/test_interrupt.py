"""Long computations release the GIL, report progress, and stop on
KeyboardInterrupt (a SIGINT to the process, as Ctrl-C or a notebook's
interrupt sends it) within a second, raising it."""

import os
import signal
import subprocess
import threading
import time

import pytest

import elbowroom as er


@pytest.mark.skipif(not hasattr(signal, "SIGINT") or os.name != "posix", reason="needs POSIX signals")
def test_keyboard_interrupt_stops_hessenberg_15():
    # the default h of n = 15 lists 11 333 950 permutations: seconds of work, then
    # seconds of building the dict. The SIGINT comes from another process, as a
    # terminal's Ctrl-C does (a Python timer thread would need the interpreter lock
    # to send it, which a loaded machine may not give it in time).
    # A process started in the background by a non-interactive shell inherits SIGINT
    # ignored, and Python then installs no KeyboardInterrupt handler: install it here.
    previous = signal.signal(signal.SIGINT, signal.default_int_handler)
    start = time.monotonic()
    killer = subprocess.Popen(["sh", "-c", f"sleep 0.5; kill -INT {os.getpid()}"])
    try:
        with pytest.raises(KeyboardInterrupt):
            er.hessenberg(15)
        stopped = time.monotonic()
    finally:
        killer.wait()
        signal.signal(signal.SIGINT, previous)
    # the signal left at 0.5 s at the earliest
    reaction = stopped - (start + 0.5)
    print(f"hessenberg(15) stopped {reaction * 1000:.0f} ms after SIGINT "
          f"({stopped - start:.2f} s after the call)")
    assert reaction < 1.0
    # the module still works afterwards
    assert er.hessenberg(3) == {(2, 3, 1): 1, (3, 1, 2): 1}


def test_an_exception_in_the_progress_callback_stops_the_work():
    calls = []

    def callback(done, total):
        calls.append((done, total))
        if len(calls) >= 2:
            raise RuntimeError("enough")

    start = time.monotonic()
    with pytest.raises(RuntimeError, match="enough"):
        er.hessenberg(15, progress=callback)
    assert time.monotonic() - start < 5.0
    assert len(calls) == 2
    assert all(total > 0 for _, total in calls)


def test_progress_reports_done_and_total():
    calls = []
    er.count_reduced_words((3, 1, 4, 2, 5), progress=lambda d, t: calls.append((d, t)))
    table = er.hessenberg(11, [2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 11],
                          progress=lambda d, t: calls.append((d, t)))
    assert len(table) == 51909  # M(11, 10), OEIS A008302
    assert calls
    assert all(0 <= d for d, t in calls)
    last_done, last_total = calls[-1]
    assert last_total > 0 and last_done == last_total


def test_the_gil_is_released_while_computing():
    ticks = [0]
    stop = threading.Event()

    def count():
        while not stop.is_set():
            ticks[0] += 1
            time.sleep(0.001)

    t = threading.Thread(target=count)
    t.start()
    try:
        before = ticks[0]
        start = time.monotonic()
        er.quotient_basis(8)  # builds the basis of J_8 (or finds it built)
        er.hessenberg(12, [2, 3, 4, 5, 6, 7, 8, 9, 10, 12, 12, 12])  # used by no other test
        elapsed = time.monotonic() - start
        during = ticks[0] - before
    finally:
        stop.set()
        t.join()
    if elapsed < 0.2:
        pytest.skip(f"the computations took {elapsed:.2f} s, too short to tell")
    # a thread that sleeps 1 ms per tick gets up to elapsed/1 ms ticks when the
    # GIL is free (fewer on a loaded machine); with the GIL held throughout it
    # would get a handful at most (one per switch interval, 5 ms, at best)
    assert during > 20 * elapsed
