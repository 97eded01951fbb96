"""Command line: ``python -m service openapi`` prints the OpenAPI document as YAML."""

from __future__ import annotations

import argparse
import sys

from service import create_app
from service.api.openapi import document_yaml


def main() -> None:
    parser = argparse.ArgumentParser(prog="python -m service", description=__doc__)
    parser.add_argument("command", choices=["openapi"], help="what to print")
    parser.parse_args()
    with create_app().app_context():
        sys.stdout.write(document_yaml())


if __name__ == "__main__":
    main()
