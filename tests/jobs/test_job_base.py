"""The job result base: warnings collected from the core layers reach the record."""

import warnings

import pytest

from heatcalc.jobs import JobResult, JobWarning


class _Stretched(UserWarning):
    pass


def test_collecting_moves_chosen_warnings_into_the_result_once():
    res = JobResult(title="t")
    with pytest.warns(JobWarning, match="model stretched"):
        with res.collecting(_Stretched):
            warnings.warn("model stretched", _Stretched, stacklevel=1)
            warnings.warn("model stretched", _Stretched, stacklevel=1)  # same text: once
    assert res.warnings == ["model stretched"]


def test_collecting_lets_other_warnings_through_unchanged():
    res = JobResult(title="t")
    with pytest.warns(RuntimeWarning, match="something else"):
        with res.collecting(_Stretched):
            warnings.warn("something else", RuntimeWarning, stacklevel=1)
    assert res.warnings == []
