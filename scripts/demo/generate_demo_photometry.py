#!/usr/bin/python3
"""The demo event Cinder Avocet's photometry (an invented event of the demo proposal,
db/seed/demo-scenario.ts): a rising point-lens light curve observed until 2031-06-04, about a week
before the stored peak (2031-06-11 04:00 UTC), written to public/demo/cinder-avocet-photometry.csv.
Run with Debian's /usr/bin/python3 (python3-numpy, python3-astropy); one fixed seed, so the file is
the same at every run.

Two datasets in one file, named by its "telescope" column: the invented Halcyon Survey in I, about
four visits a night from 2031-03-20, and the demo site Mesa Lucerna in V, about six a night from
2031-05-18, each night with a chance of clouds. Times are HJD (UTC) - 2450000, the column's header
says so ("HJD-2450000 (UTC)"), so the upload's mapping proposes the time kind, offset and scale.

The truth differs from the target's stored hypothesis (t0 2031-06-11 04:00 UTC, u0 0.12, source
17.8 mag, f_s 0.7), so that applying a fit of this file changes its verdicts:
  t0 = 2031-06-13 10:00 UTC (geocentric), u0 = 0.08, t_E = 28 d,
  I: source 18.1 mag, f_s = 0.6 (the source's share of the baseline flux);
  V: source 19.9 mag, f_s = 0.5.
Model (B. Paczynski 1986, ApJ 304, 1): A(u) = (u^2 + 2)/(u sqrt(u^2 + 4)),
u(t) = sqrt(u0^2 + ((t - t0)/t_E)^2); flux F = F_s A(u) + F_b with F_b = F_s (1/f_s - 1).
Errors (our choice, those of a good 1-2 m telescope, small enough that a fit of the rising wing
alone pins the peak to about 2 days): sigma = 0.003 + 0.005 * 10^(0.4 (m - 18)) in I,
0.004 + 0.006 * 10^(0.4 (m - 19.5)) in V; each magnitude is the model's plus Gaussian noise of sigma.
HJD = t + astropy's heliocentric light travel time for the event's direction at the geocentre
(Time.light_travel_time, ERFA's built-in ephemeris), as the upload's reader assumes for an HJD.
The reader takes no comment lines in a CSV, so the truth is written here only.
"""

import os
import warnings

import astropy.units as u
import numpy as np
from astropy import log
from astropy.coordinates import EarthLocation, SkyCoord
from astropy.time import Time
from astropy.utils import iers
from erfa import ErfaWarning

iers.conf.auto_download = False
iers.conf.iers_degraded_accuracy = "ignore"
warnings.filterwarnings("ignore", category=ErfaWarning)
# Past the IERS tables astropy warns of polar motion (arcseconds: nothing at the geocentre) and of
# its leap-second file's age (the product counts none after 2017 either).
log.setLevel("ERROR")

OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "public", "demo", "cinder-avocet-photometry.csv")
SEED = 117
EVENT = SkyCoord("17 52 31.8", "-29 41 07", unit=(u.hourangle, u.deg))
GEOCENTRE = EarthLocation.from_geocentric(0 * u.m, 0 * u.m, 0 * u.m)

T0_JD_UTC = Time("2031-06-13T10:00:00", scale="utc").jd
U0 = 0.08
TE_DAYS = 28.0
LAST_NIGHT = "2031-06-04"
DATASETS = [
    # telescope, band, first night, visits a night, source magnitude, f_s, error model (floor, scale, reference mag), chance of a clouded night
    ("Halcyon Survey", "I", "2031-03-20", 4, 18.1, 0.6, (0.003, 0.005, 18.0), 0.25),
    ("Mesa Lucerna", "V", "2031-05-18", 6, 19.9, 0.5, (0.004, 0.006, 19.5), 0.2),
]


def magnification(u_):
    return (u_ * u_ + 2) / (u_ * np.sqrt(u_ * u_ + 4))


def magnitudes(jd_utc, source_mag, source_fraction):
    u_ = np.sqrt(U0**2 + ((jd_utc - T0_JD_UTC) / TE_DAYS) ** 2)
    source_flux = 10 ** (-0.4 * source_mag)
    blend_flux = source_flux * (1 / source_fraction - 1)
    return -2.5 * np.log10(source_flux * magnification(u_) + blend_flux)


def main():
    rng = np.random.default_rng(SEED)
    last = Time(f"{LAST_NIGHT}T00:00:00", scale="utc").jd
    rows = []
    for telescope, band, first_night, visits, source_mag, source_fraction, (floor, scale, ref), cloud_chance in DATASETS:
        nights = np.arange(Time(f"{first_night}T00:00:00", scale="utc").jd, last + 1)
        for night in nights:
            if rng.random() < cloud_chance:
                continue
            # The bulge is up from about 01:00 to 09:00 UTC at these longitudes (near -69 deg).
            times = np.sort(night + (1 + 8 * rng.random(visits)) / 24)
            true_mags = magnitudes(times, source_mag, source_fraction)
            sigmas = floor + scale * 10 ** (0.4 * (true_mags - ref))
            observed = true_mags + sigmas * rng.standard_normal(visits)
            t = Time(times, format="jd", scale="utc")
            hjd = t + t.light_travel_time(EVENT, kind="heliocentric", location=GEOCENTRE)
            for h, m, s in zip(hjd.utc.jd, observed, sigmas):
                rows.append((h - 2450000, m, s, band, telescope))
    rows.sort(key=lambda row: (row[4] != "Halcyon Survey", row[0]))
    with open(OUT, "w", encoding="utf-8", newline="\n") as out:
        out.write("HJD-2450000 (UTC),mag,mag_err,band,telescope\n")
        for h, m, s, band, telescope in rows:
            out.write(f"{h:.5f},{m:.3f},{s:.3f},{band},{telescope}\n")
    counts = {name: sum(1 for row in rows if row[4] == name) for name, *_ in DATASETS}
    print(f"wrote {len(rows)} points {counts} to {os.path.relpath(OUT)}")


if __name__ == "__main__":
    main()
