"""Shared test settings: a bounded hypothesis profile for CI."""

import os

from hypothesis import HealthCheck, settings

settings.register_profile(
    "ci", max_examples=60, deadline=None, suppress_health_check=[HealthCheck.too_slow],
    derandomize=True,
)
settings.register_profile("long", max_examples=5000, deadline=None)
settings.load_profile(os.environ.get("NUMCHECK_HYPOTHESIS_PROFILE", "ci"))
