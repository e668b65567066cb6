#!/usr/bin/python3
"""plumbline batch on Dask distributed: a whole literature over a cluster.

Reads what `plumbline batch` reads (one path or one NDJSON document per line) on standard input,
cuts it into partitions of whole lines, and has Dask workers pipe each partition through
`plumbline batch --jobs 1 --first-line K`, K being the partition's first line in the whole input,
so that messages and the names of documents without an id are the single run's. Standard output
gets the partitions' output in input order, byte for byte what one `plumbline batch` run on the
same input writes; standard error gets progress (documents done, rate, time left) and, last, the
summary line in batch's own form, with the counts of all partitions added up. The exit status is
batch's: 2 when a line could not be checked, else 1 when a document had an error-level finding,
else 0; 2 as well when the run itself failed (a partition that failed every retry, no workers).

Engine: Dask distributed (Debian's python3-distributed), with /usr/bin/python3. `--scheduler
ADDRESS` connects to a running scheduler; `--workers N` starts a local cluster of N worker
processes on loopback instead.

Failures: the liveness of a worker is Dask's own business: each worker sends the scheduler a
heartbeat and holds a connection to it; when a worker's process dies the connection drops, and
when it hangs its heartbeats stop (the scheduler's `distributed.scheduler.worker-ttl`, 5 minutes
by default, then removes it). Either way the scheduler gives its partitions to another worker
(up to `distributed.scheduler.allowed-failures` times per partition). A partition whose
plumbline run fails (killed, or answering fewer lines than it was given) is retried
`--retries` times. Each partition's output is written exactly once, by this process, at its
place in the input order: a partition computed twice is still written once, and a partition
that never succeeds stops the run rather than leave a hole.

Workers run the plumbline command given by `--plumbline` (a command line, split as a shell
would; default: `plumbline` when it is on this machine's PATH, else `node dist/bin/plumbline.js`
of the checkout this script is in), in the folder `--cwd` (default: the current one), so paths
and configuration files must be where the workers can read them at the same place. Every worker
is asked for the command's version before the run, and all must give the same one, since the
output must not depend on which worker checked a document.

Words after `--` are passed to `plumbline batch` as they are (for example `-- --alpha 0.01`).
"""
import argparse
import os
import re
import shlex
import shutil
import subprocess
import sys
import time
import warnings

SUMMARY = re.compile(r'^plumbline batch: (\d+) lines, (\d+) results, (\d+) findings, (\d+) not checked$')
HERE = os.path.dirname(os.path.abspath(__file__))


def check_partition(command, extra, cwd, first_line, data):
    """Runs on a worker: one partition through `plumbline batch --jobs 1`.

    Returns (stdout bytes, exit code, (lines, results, findings, not checked), other stderr lines).
    Raises when the run is not a whole answer, so that Dask retries it.
    """
    import re as _re
    import subprocess as _subprocess

    argv = command + ['batch', '--jobs', '1', '--first-line', str(first_line)] + extra
    done = _subprocess.run(argv, input=data, stdout=_subprocess.PIPE, stderr=_subprocess.PIPE, cwd=cwd, check=False)
    err = done.stderr.decode('utf-8', 'replace').splitlines()
    given = data.count(b'\n')
    answered = done.stdout.count(b'\n')
    summary = [m for m in (_re.match(SUMMARY.pattern, line) for line in err) if m]
    if done.returncode not in (0, 1, 2) or answered != given or len(summary) != 1:
        tail = ' | '.join(err[-3:]) or 'nothing on standard error'
        raise RuntimeError(f'plumbline batch on lines {first_line} to {first_line + given - 1} exited {done.returncode} '
                           f'and answered {answered} of {given} lines ({tail})')
    counts = tuple(int(g) for g in summary[0].groups())
    others = [line for line in err if not _re.match(SUMMARY.pattern, line)]
    return done.stdout, done.returncode, counts, others


def command_version(command, cwd):
    """Runs on each worker: the plumbline command's version, or why it could not be run."""
    import subprocess as _subprocess
    try:
        done = _subprocess.run(command + ['--version'], stdout=_subprocess.PIPE, stderr=_subprocess.PIPE, cwd=cwd, check=False, timeout=120)
    except OSError as e:
        return f'cannot run {command[0]}: {e.strerror}'
    if done.returncode != 0:
        return f'{" ".join(command)} --version exited {done.returncode}'
    return 'version ' + done.stdout.decode('utf-8', 'replace').strip()


def default_command():
    if shutil.which('plumbline'):
        return ['plumbline']
    # the one place this script knows where a checkout builds the CLI
    built = os.path.join(HERE, '..', 'dist', 'bin', 'plumbline.js')
    if os.path.exists(built) and shutil.which('node'):
        return ['node', os.path.abspath(built)]
    return None


def partitions(stream, max_lines, max_bytes):
    """(first line number, bytes of whole lines each ending in LF) in input order.

    Lines are cut at LF only, as batch cuts them; a last line without LF gets one (batch reads it
    the same either way)."""
    first = 1
    lines = []
    size = 0
    for line in stream:
        if not line.endswith(b'\n'):
            line += b'\n'
        lines.append(line)
        size += len(line)
        if len(lines) >= max_lines or size >= max_bytes:
            yield first, b''.join(lines)
            first += len(lines)
            lines = []
            size = 0
    if lines:
        yield first, b''.join(lines)


def count_lines(stream):
    """The number of input lines when standard input is a regular file (read once, then rewound)."""
    try:
        if not os.path.isfile(f'/proc/self/fd/{stream.fileno()}') or not stream.seekable():
            return None
        start = stream.tell()
    except (OSError, ValueError):
        return None
    n = 0
    last = b'\n'
    while True:
        chunk = stream.read(1 << 20)
        if not chunk:
            break
        n += chunk.count(b'\n')
        last = chunk[-1:]
    stream.seek(start)
    return n + (0 if last == b'\n' else 1)


class Progress:
    """Documents done, rate and time left on standard error, at most every `every` seconds."""

    def __init__(self, every, total):
        self.every = every
        self.total = total
        self.start = time.monotonic()
        self.shown = None

    def show(self, done, last=False):
        now = time.monotonic()
        if not last and self.shown is not None and now - self.shown < self.every:
            return
        self.shown = now
        elapsed = now - self.start
        rate = done / elapsed if elapsed > 0 else 0.0
        if self.total is None:
            left = 'time left known once the input is read (--total N gives it)'
            of = ''
        else:
            of = f' of {self.total}'
            left = f'about {round((self.total - done) / rate)} s left' if rate > 0 else 'time left not known yet'
        if last:
            left = f'{elapsed:.1f} s in all'
        sys.stderr.write(f'plumbline dask: {done}{of} documents, {rate:.1f} documents/s, {left}\n')
        sys.stderr.flush()


def main(argv):
    if '--' in argv:
        cut = argv.index('--')
        argv, extra = argv[:cut], argv[cut + 1:]
    else:
        extra = []
    ap = argparse.ArgumentParser(prog='dask-batch.py', description='plumbline batch over Dask distributed: NDJSON in, NDJSON out in input order.')
    where = ap.add_mutually_exclusive_group(required=True)
    where.add_argument('--scheduler', metavar='ADDRESS', help='address of a running Dask scheduler (tcp://host:8786)')
    where.add_argument('--workers', metavar='N', type=int, help='start a local cluster of N worker processes on loopback')
    ap.add_argument('--plumbline', metavar='COMMAND', help='the plumbline command the workers run, split as a shell would (default: plumbline on PATH, else node dist/bin/plumbline.js of this checkout)')
    ap.add_argument('--cwd', metavar='DIR', default=os.getcwd(), help='folder the workers run plumbline in; relative paths are read from there (default: the current folder)')
    ap.add_argument('--partition-lines', metavar='N', type=int, default=200, help='input lines per partition (default 200)')
    ap.add_argument('--partition-bytes', metavar='N', type=int, default=8 << 20, help='a partition ends once it holds N bytes (default 8 MiB)')
    ap.add_argument('--window', metavar='N', type=int, help='partitions submitted and not yet written, at most (default: 2 per worker thread, 4 at least); bounds the memory of this process and the scheduler')
    ap.add_argument('--retries', metavar='N', type=int, default=2, help='times a failed partition is run again (default 2); a lost worker\'s partitions are rescheduled by Dask besides')
    ap.add_argument('--total', metavar='N', type=int, help='number of input lines, for the time left when standard input is a pipe')
    ap.add_argument('--progress-seconds', metavar='S', type=float, default=10.0, help='seconds between progress lines (default 10; 0: after every partition)')
    args = ap.parse_args(argv)
    for name in ('workers', 'partition_lines', 'partition_bytes', 'window'):
        value = getattr(args, name)
        if value is not None and value < 1:
            ap.error(f'--{name.replace("_", "-")} must be 1 or more')
    if args.retries < 0:
        ap.error('--retries must be 0 or more')

    command = shlex.split(args.plumbline) if args.plumbline is not None else default_command()
    if not command:
        ap.error('no plumbline command: install plumbline on PATH, or give --plumbline COMMAND')

    try:
        from distributed import Client, LocalCluster, as_completed
    except ImportError:
        sys.stderr.write('dask-batch.py: Dask distributed is not installed (Debian: apt-get install python3-distributed)\n')
        return 2

    # Each partition travels inside its task, so that the scheduler still holds it when the worker
    # it went to dies and can hand it to another; scattered data would die with that worker. Dask
    # warns about task arguments over 1 MiB for that reason; here it is the point.
    warnings.filterwarnings('ignore', message='Large object of size', category=UserWarning)
    stdin = sys.stdin.buffer
    total = args.total if args.total is not None else count_lines(stdin)
    cluster = None
    if args.workers is not None:
        # loopback only, no dashboard: nothing listens beyond this machine
        cluster = LocalCluster(n_workers=args.workers, threads_per_worker=1, processes=True, host='127.0.0.1', dashboard_address=None)
        client = Client(cluster)
    else:
        client = Client(args.scheduler)
    try:
        return run(client, as_completed, command, extra, args, stdin, total)
    finally:
        client.close()
        if cluster is not None:
            cluster.close()


def run(client, as_completed, command, extra, args, stdin, total):
    threads = sum(client.nthreads().values())
    if threads == 0:
        client.wait_for_workers(1, timeout=60)
        threads = sum(client.nthreads().values())
    versions = client.run(command_version, command, args.cwd)
    if len(set(versions.values())) != 1 or not next(iter(versions.values())).startswith('version '):
        described = '; '.join(f'{w}: {v}' for w, v in sorted(versions.items()))
        sys.stderr.write(f'dask-batch.py: the workers must all run the same plumbline ({described})\n')
        return 2
    window = args.window or max(4, 2 * threads)
    progress = Progress(args.progress_seconds, total)
    out = sys.stdout.buffer
    source = partitions(stdin, args.partition_lines, args.partition_bytes)
    pending = as_completed()
    index_of = {}
    ready = {}
    sizes = {}
    submitted = 0
    read = 0
    written = 0
    documents = 0
    sums = [0, 0, 0, 0]
    worst = 0
    said = set()
    exhausted = False

    def fill():
        nonlocal submitted, read, exhausted, total
        while not exhausted and submitted - written < window:
            part = next(source, None)
            if part is None:
                exhausted = True
                if total is None:
                    total = read
                    progress.total = total
                return
            first, data = part
            sizes[submitted] = data.count(b'\n')
            read += sizes[submitted]
            future = client.submit(check_partition, command, extra, args.cwd, first, data, retries=args.retries, pure=False, key=f'plumbline-batch-{first}-{time.time_ns()}')
            index_of[future.key] = submitted
            pending.add(future)
            submitted += 1

    fill()
    for future in pending:
        index = index_of.pop(future.key, None)
        if index is None or index < written or index in ready:
            continue  # a partition already in hand is never written twice
        try:
            ready[index] = future.result()
        except Exception as e:  # every retry failed, or the workers are gone
            sys.stderr.write(f'dask-batch.py: stopped: {e}\n')
            return 2
        future.release()
        while written in ready:
            stdout_bytes, code, counts, others = ready.pop(written)
            out.write(stdout_bytes)
            out.flush()
            for line in others:
                if line not in said:
                    said.add(line)
                    sys.stderr.write(line + '\n')
            sums = [a + b for a, b in zip(sums, counts)]
            worst = max(worst, code)
            documents += sizes.pop(written)
            written += 1
        progress.show(documents)
        fill()
    progress.show(documents, last=True)
    sys.stderr.write(f'plumbline batch: {sums[0]} lines, {sums[1]} results, {sums[2]} findings, {sums[3]} not checked\n')
    if sums[3] > 0:
        return 2
    return 1 if worst == 1 else 0


if __name__ == '__main__':
    sys.exit(main(sys.argv[1:]))
