"""Fixtures for the real-browser tests (Playwright driving Debian's Chromium).

The tests skip when Chromium is missing, unless ``ILKIT_REQUIRE_BROWSER`` is
set (as ``.ci/run`` does): then a missing browser fails the run.
"""

from __future__ import annotations

import os
from pathlib import Path

import pytest

from .servers import ARTIFACTS, CHROMIUM, CHROMIUM_ARGS


def pytest_collection_modifyitems(items):
    here = Path(__file__).parent
    for item in items:
        if Path(str(item.fspath)).is_relative_to(here):
            item.add_marker(pytest.mark.browser)


@pytest.fixture(scope="session")
def chromium_path() -> str:
    if not Path(CHROMIUM).exists():
        message = f"Chromium not found at {CHROMIUM}; install it with: apt-get install chromium"
        if os.environ.get("ILKIT_REQUIRE_BROWSER"):
            pytest.fail(message)
        pytest.skip(message)
    return CHROMIUM


@pytest.fixture(scope="session")
def browser(chromium_path):
    from playwright.sync_api import sync_playwright

    with sync_playwright() as p:
        b = p.chromium.launch(executable_path=chromium_path, args=CHROMIUM_ARGS)
        yield b
        b.close()


@pytest.fixture
def page(browser):
    context = browser.new_context(viewport={"width": 1280, "height": 900})
    pg = context.new_page()
    yield pg
    context.close()


@pytest.fixture(scope="session")
def artifacts() -> Path:
    ARTIFACTS.mkdir(parents=True, exist_ok=True)
    return ARTIFACTS
