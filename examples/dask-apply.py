#!/usr/bin/env python3
"""Label a whole cohort with a Gleaner study on a Dask cluster: one `gleaner apply` per partition.

    python3 examples/dask-apply.py STUDY DATASET --out OUT [--scheduler ADDRESS] [--workers N]
                                    [--gleaner "gleaner"]

DATASET is a folder of partition files (Parquet, CSV, TSV or Arrow, for example written with
PARTITION_BY (subject): subject=S01/data_0.parquet, ...) or one such file. Every partition must
hold whole subjects when the study's recipe has per-subject steps (docs/apply.md).

Each partition is one task, run by a Dask worker as
    gleaner apply STUDY PART --out OUT/parts/<partition path> --progress none
so tasks share nothing and each writes its own labels and manifest.json. Then OUT/cohort.json lists
every partition with its input and output SHA-256s and row counts, the study's hash and the cautions
(taken from the tasks' manifests). Without --scheduler a LocalCluster of N worker processes on
loopback is started and stopped here; with it, the tasks go to that scheduler (the workers must see
the same paths and have Gleaner installed).

Needs Dask's distributed package (Debian: python3-distributed).
"""
import argparse
import json
import os
import shlex
import subprocess
import sys
import tempfile

SUFFIXES = ('.parquet', '.csv', '.tsv', '.arrow', '.feather', '.ipc')


def partitions(dataset):
    """Partition files under `dataset` (or the file itself), in sorted path order."""
    if os.path.isfile(dataset):
        return [os.path.abspath(dataset)]
    found = []
    for root, dirs, files in os.walk(dataset):
        dirs.sort()
        for name in sorted(files):
            if name.lower().endswith(SUFFIXES) and not name.startswith('.'):
                found.append(os.path.abspath(os.path.join(root, name)))
    return found


def out_folder(out, dataset, part):
    """OUT/parts/<the partition's path inside the dataset, folders and file name joined by '/'>."""
    base = dataset if os.path.isdir(dataset) else os.path.dirname(dataset)
    rel = os.path.relpath(part, os.path.abspath(base))
    return os.path.join(os.path.abspath(out), 'parts', rel)


def apply_one(gleaner, study, part, out, cwd):
    """One task: run `gleaner apply` on one partition; returns what it printed and its manifest."""
    os.makedirs(out, exist_ok=True)
    cmd = shlex.split(gleaner) + ['apply', study, part, '--out', out, '--progress', 'none']
    run = subprocess.run(cmd, cwd=cwd, capture_output=True, text=True)
    manifest = None
    if run.returncode == 0:
        with open(os.path.join(out, 'manifest.json'), encoding='utf-8') as f:
            manifest = json.load(f)
    return {'part': part, 'out': out, 'status': run.returncode, 'stderr': run.stderr.strip(), 'manifest': manifest}


def write_atomic(path, text):
    """Readers see the old file or the whole new one: write a temporary file, flush, rename."""
    folder = os.path.dirname(path)
    fd, temp = tempfile.mkstemp(prefix='.cohort.', suffix='.tmp', dir=folder)
    try:
        with os.fdopen(fd, 'w', encoding='utf-8') as f:
            f.write(text)
            f.flush()
            os.fsync(f.fileno())
        os.replace(temp, path)
    except BaseException:
        if os.path.exists(temp):
            os.remove(temp)
        raise


def main(argv=None):
    p = argparse.ArgumentParser(description=__doc__.split('\n\n')[0])
    p.add_argument('study')
    p.add_argument('dataset')
    p.add_argument('--out', required=True)
    p.add_argument('--scheduler', help='address of a running Dask scheduler (default: a LocalCluster here)')
    p.add_argument('--workers', type=int, default=2, help='worker processes of the LocalCluster (default 2)')
    p.add_argument('--gleaner', default=os.environ.get('GLEANER', 'gleaner'), help='how to run Gleaner (default $GLEANER or "gleaner")')
    args = p.parse_args(argv)

    parts = partitions(args.dataset)
    if not parts:
        print(f'dask-apply: no partition files ({", ".join(SUFFIXES)}) under {args.dataset}', file=sys.stderr)
        return 1
    study = os.path.abspath(args.study)
    cwd = os.getcwd()
    from distributed import Client, LocalCluster  # imported here so --help works without Dask

    cluster = None
    if args.scheduler:
        client = Client(args.scheduler)
    else:
        # Loopback only, no dashboard: nothing is reachable from outside this machine.
        cluster = LocalCluster(n_workers=args.workers, threads_per_worker=1, processes=True,
                               host='127.0.0.1', dashboard_address=None)
        client = Client(cluster)
    try:
        futures = [client.submit(apply_one, args.gleaner, study, part, out_folder(args.out, args.dataset, part), cwd,
                                 key=f'gleaner-apply-{i}', pure=False) for i, part in enumerate(parts)]
        results = client.gather(futures)
    finally:
        client.close()
        if cluster is not None:
            cluster.close()

    failed = [r for r in results if r['status'] != 0]
    for r in failed:
        print(f'dask-apply: {r["part"]}: {r["stderr"] or "exit " + str(r["status"])}', file=sys.stderr)
    if failed:
        print(f'dask-apply: {len(failed)} of {len(parts)} partitions failed; cohort.json not written', file=sys.stderr)
        return 1
    first = results[0]['manifest']
    cohort = {
        'command': 'dask-apply.py (gleaner apply per partition)',
        'study': first['study'],
        'assignment': first['assignment'],
        'clusters': first['clusters'],
        'partitions': [
            {'labels': os.path.relpath(os.path.join(r['out'], i['output']), os.path.abspath(args.out)), **i}
            for r in results for i in r['manifest']['inputs']
        ],
        'windows': sum(i['labelled'] for r in results for i in r['manifest']['inputs']),
        'cautions': first['cautions'],
    }
    os.makedirs(args.out, exist_ok=True)
    write_atomic(os.path.join(args.out, 'cohort.json'), json.dumps(cohort, indent=2) + '\n')
    print(f'dask-apply: labelled {cohort["windows"]} windows in {len(parts)} partitions; wrote {os.path.join(args.out, "cohort.json")}')
    return 0


if __name__ == '__main__':
    sys.exit(main())
