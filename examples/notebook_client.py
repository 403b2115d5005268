#!/usr/bin/env python3
"""Review two bottling-plant loops with a running loopgate service.

What a notebook user would paste: standard library only (urllib), no
client package. It posts

  * the filler-pump speed loop as a measured frequency-response sweep
    (examples/data/filler-pump-sweep.csv, demo data) under its PI controller,
  * the pasteuriser temperature loop as a model (transfer function with dead
    time) under its series PID controller,

prints the margins of each, and saves an HTML report of each loop
(POST /v1/reports). The plants and tunings are the demo loops of
src/demo/bottling-plant.ts: invented demo numbers, not a real plant.

Run:
    npm start                                   # in another terminal
    python3 examples/notebook_client.py [BASE_URL]

BASE_URL defaults to $LOOPGATE_URL, then http://127.0.0.1:8080. Reports go
to $LOOPGATE_REPORT_DIR (default: the current directory).
"""
import json
import os
import sys
import urllib.error
import urllib.request
from pathlib import Path

# Filler-pump speed loop: PI, K = 3.5, Ti = 0.39 s (standard form).
FILLER_PUMP_PI = {'kind': 'pid', 'form': 'standard', 'gain': 3.5, 'integralTime': 0.39}

# Pasteuriser temperature loop: P(s) = 1.8·e^(−14 s)/((95 s + 1)(22 s + 1)),
# series PID K = 1.9, Ti = 95 s, Td = 22 s, derivative filter N = 10.
PASTEURISER_PLANT = {'kind': 'transfer-function', 'numerator': [1.8], 'denominator': [2090, 117, 1], 'delay': 14}
PASTEURISER_PID = {'kind': 'pid', 'form': 'series', 'gain': 1.9, 'integralTime': 95, 'derivativeTime': 22, 'derivativeFilter': {'n': 10}}


def base_url(argv):
    """The first http(s) argument, else $LOOPGATE_URL, else the default.

    Only URL-looking arguments count, so a notebook kernel's own arguments
    (sys.argv there is the kernel's) are ignored.
    """
    for arg in argv:
        if arg.startswith(('http://', 'https://')):
            return arg.rstrip('/')
    return os.environ.get('LOOPGATE_URL', 'http://127.0.0.1:8080').rstrip('/')


def data_file(name):
    """examples/data/NAME beside this script, or relative to the working directory in a notebook."""
    here = Path(__file__).resolve().parent if '__file__' in globals() else Path('examples')
    return here / 'data' / name


class ServiceError(Exception):
    """The service answered 4xx/5xx: its JSON error (statusCode, code, message, issues)."""

    def __init__(self, status, body):
        self.status = status
        self.body = body
        try:
            error = json.loads(body)
            text = f"{error.get('code')}: {error.get('message')}"
            for issue in error.get('issues') or []:
                text += f"\n  at {'.'.join(str(p) for p in issue.get('path', []))}: {issue.get('message')}"
        except ValueError:
            text = body[:200]
        super().__init__(f'HTTP {status} {text}')


def post(url, body):
    """POST a JSON body; return (content type, response bytes) or raise ServiceError."""
    request = urllib.request.Request(url, data=json.dumps(body).encode('utf-8'), method='POST',
                                     headers={'content-type': 'application/json'})
    try:
        with urllib.request.urlopen(request, timeout=60) as response:
            return response.headers.get('content-type', ''), response.read()
    except urllib.error.HTTPError as error:
        raise ServiceError(error.code, error.read().decode('utf-8', 'replace')) from None


def analyse(url, request):
    """POST /v1/analyses: the answer as a dict."""
    _, body = post(f'{url}/v1/analyses', request)
    return json.loads(body)


def fmt(x):
    """Four significant figures, trailing zeros kept (a reading, not a proof)."""
    return format(x, '#.4g')


def measured_note(margin, unit, key):
    """For measured plants: the interpolation error and the coherence-based uncertainty of a margin."""
    parts = []
    if 'interpolationError' in margin:
        parts.append(f"interpolation ±{fmt(margin['interpolationError'][key])} {unit}")
    if 'uncertainty' in margin:
        parts.append(f"uncertainty ±{fmt(margin['uncertainty'][key])} {unit}")
    return f"  [{', '.join(parts)}]" if parts else ''


def print_margins(title, answer):
    m = answer['margins']
    print(f'== {title}')
    print(f"request hash:      {answer['requestHash']}")
    stability = answer['stability']
    print(f"closed loop:       {'stable' if stability['closedLoopStable'] else 'UNSTABLE'} ({stability['method']})")
    gain = m['gain']
    if gain is None:
        print('gain margin:       none (no phase crossover)')
    else:
        print(f"gain margin:       {fmt(gain['db'])} dB (ratio {fmt(gain['ratio'])}) at {fmt(gain['frequency'])} rad/s"
              + measured_note(gain, 'dB', 'db'))
    phase = m['phase']
    if phase is None:
        print('phase margin:      none (no gain crossover)')
    else:
        print(f"phase margin:      {fmt(phase['degrees'])} deg at {fmt(phase['frequency'])} rad/s"
              + measured_note(phase, 'deg', 'degrees'))
    delay = m['delay']
    if delay is None:
        print('delay margin:      none (no gain crossover with a positive phase margin)')
    else:
        print(f"delay margin:      {fmt(delay['seconds'])} s at {fmt(delay['frequency'])} rad/s"
              + measured_note(delay, 's', 'seconds'))
    ms = answer['peaks']['sensitivity']
    at = f" at {fmt(ms['frequency'])} rad/s" if ms['frequency'] is not None else ''
    print(f"sensitivity peak:  Ms = {fmt(ms['value'])} ({fmt(ms['db'])} dB){at}")
    warnings = answer['warnings']
    print(f"warnings:          {', '.join(w['code'] for w in warnings) if warnings else 'none'}")
    for w in warnings:
        print(f"  - {w['message']}")
    print()


def save_report(url, name, title, request, directory):
    """POST /v1/reports → NAME-report.html; says so and returns None when the server has no report route."""
    # The report carries the full responses and its plots, so no 'detail' here.
    report_request = {'plant': request['plant'], 'controller': request['controller'], 'report': {'title': title}}
    try:
        _, html = post(f'{url}/v1/reports', report_request)
    except ServiceError as error:
        if error.status == 404:
            print(f'report for {name}: not saved, this server has no POST /v1/reports (404)')
            return None
        raise
    path = Path(directory) / f'{name}-report.html'
    path.write_bytes(html)
    print(f'report for {name}: saved to {path}')
    return path


def main(argv):
    url = base_url(argv)
    report_dir = os.environ.get('LOOPGATE_REPORT_DIR', '.')
    loops = [
        ('filler-pump-speed', 'Filler-pump speed loop, measured sweep (PI, K = 3.5, Ti = 0.39 s)', {
            'plant': {
                'kind': 'frequency-response',
                'csv': data_file('filler-pump-sweep.csv').read_text(encoding='utf-8'),
                'frequencyUnit': 'Hz',
                'magnitudeUnit': 'dB',
                'phaseUnit': 'deg',
                'averages': 16,
                # A pump on a motor is open-loop stable; saying so lets the Nyquist verdict rest on fact.
                'openLoopUnstablePoles': 0,
            },
            'controller': FILLER_PUMP_PI,
            'detail': 'summary',
        }),
        ('pasteuriser-temperature', 'Pasteuriser temperature loop, model (series PID, K = 1.9, Ti = 95 s, Td = 22 s, N = 10)', {
            'plant': PASTEURISER_PLANT,
            'controller': PASTEURISER_PID,
            'detail': 'summary',
        }),
    ]
    try:
        answers = [analyse(url, request) for _, _, request in loops]
        for (_, title, _), answer in zip(loops, answers):
            print_margins(title, answer)
        print(answers[-1]['caution'])
        print()
        for name, title, request in loops:
            save_report(url, name, title, request, report_dir)
    except ServiceError as error:
        print(f'loopgate refused the request: {error}', file=sys.stderr)
        return 1
    except urllib.error.URLError as error:
        print(f'cannot reach loopgate at {url} ({error.reason}); start it with `npm start` or pass its URL', file=sys.stderr)
        return 1
    return 0


if __name__ == '__main__':
    sys.exit(main(sys.argv[1:]))
