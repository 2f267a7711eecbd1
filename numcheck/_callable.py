"""Packages that are also the front door's functions (``numcheck.restore``).

``numcheck/__init__.py`` offers ``identify``, ``restore`` and ``audit``
lazily, but importing the package ``numcheck.restore`` binds the attribute
``numcheck.restore`` to the package.  Such a package makes itself callable,
so that ``numcheck.restore(...)`` works however the package was imported.
"""

from __future__ import annotations

import sys
import types
from collections.abc import Callable

__all__ = ["make_package_callable"]


def make_package_callable(module_name: str, function: Callable) -> None:
    """Let the package *module_name* answer a call the way *function* does."""

    class _CallablePackage(types.ModuleType):
        def __call__(self, *args, **kwargs):
            return function(*args, **kwargs)

    _CallablePackage.__doc__ = f"The package {module_name}, callable as {function.__name__}()."
    sys.modules[module_name].__class__ = _CallablePackage
