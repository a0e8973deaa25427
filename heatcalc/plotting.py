"""Plot style for calculation records: one look for every workbook, PNG output.

Figures in a record are shown as PNG images (never SVG: recorded SVG text changes between
library versions) with a fixed size and resolution, so that the same inputs give the same
picture. Job-specific plots build on these helpers.

Examples
--------
>>> fig, ax = new_figure()
>>> _ = ax.plot([0, 1], [20, 1200])
>>> _ = ax.set_ylabel(axis_label("Surface temperature", "°C"))
>>> png = to_png(fig)
>>> png[:8] == b"\\x89PNG\\r\\n\\x1a\\n"
True
"""

from __future__ import annotations

import contextlib
import io

import matplotlib as mpl
from matplotlib.figure import Figure

__all__ = [
    "RECORD_STYLE",
    "record_style",
    "use_record_style",
    "new_figure",
    "axis_label",
    "to_png",
    "show",
]

#: Matplotlib settings of record figures.
RECORD_STYLE = {
    "figure.dpi": 100,
    "savefig.dpi": 100,
    "font.size": 10,
    "axes.titlesize": 11,
    "axes.labelsize": 10,
    "axes.grid": True,
    "grid.alpha": 0.35,
    "axes.spines.top": False,
    "axes.spines.right": False,
    "legend.frameon": False,
    "lines.linewidth": 1.8,
    "axes.prop_cycle": mpl.cycler(
        color=["#1f4e79", "#c0392b", "#2e7d32", "#8e44ad", "#e67e22", "#455a64"]
    ),
}

_MM_PER_INCH = 25.4


@contextlib.contextmanager
def record_style():
    """Context in which matplotlib uses :data:`RECORD_STYLE`."""
    with mpl.rc_context(RECORD_STYLE):
        yield


def use_record_style() -> None:
    """Set :data:`RECORD_STYLE` in matplotlib's global settings (call once in a workbook).

    :func:`new_figure` applies the style to what it creates (axes, grid, colours, label
    sizes); artists added later (lines, legends) read matplotlib's settings when they are
    made, so a workbook calls this once at the top.
    """
    mpl.rcParams.update(RECORD_STYLE)


def new_figure(width: float = 160.0, height: float = 90.0, nrows: int = 1, ncols: int = 1):
    """A figure in the record style, not attached to pyplot (no stray display).

    Parameters
    ----------
    width, height : float [mm]
        Figure size on the page; the default fits an A4 page with margins.
    nrows, ncols : int
        Grid of axes.

    Returns
    -------
    (matplotlib.figure.Figure, matplotlib.axes.Axes or numpy.ndarray of Axes)

    Raises
    ------
    ValueError
        If a size is not positive or the grid is not at least 1 x 1.
    """
    for name, v in (("width", width), ("height", height)):
        if not v > 0:
            raise ValueError(f"{name}={v!r} mm must be positive")
    for name, v in (("nrows", nrows), ("ncols", ncols)):
        if not isinstance(v, int) or v < 1:
            raise ValueError(f"{name}={v!r} must be an integer >= 1")
    with record_style():
        fig = Figure(figsize=(width / _MM_PER_INCH, height / _MM_PER_INCH), layout="constrained")
        axes = fig.subplots(nrows, ncols, squeeze=True)
    return fig, axes


def axis_label(quantity: str, unit: str) -> str:
    """Axis label in the record's form, ``"Quantity [unit]"``.

    >>> axis_label("Heating time", "s")
    'Heating time [s]'
    """
    return f"{quantity} [{unit}]" if unit else quantity


def to_png(fig: Figure) -> bytes:
    """The figure as PNG bytes at the record resolution, without a software stamp."""
    buf = io.BytesIO()
    with record_style():
        fig.savefig(buf, format="png", metadata={"Software": None})
    return buf.getvalue()


def show(fig: Figure) -> None:
    """Display the figure in a notebook as a PNG image (deterministic, exports as an image)."""
    from IPython.display import Image, display

    display(Image(data=to_png(fig), format="png"))
