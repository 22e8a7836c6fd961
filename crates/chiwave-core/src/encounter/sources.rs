//! The source of every encounter output key, as shown beside each number (`sources` in the
//! result: output key → citation).

use std::collections::BTreeMap;

/// Output key → citation, gravitational encounter.
pub(crate) fn gravity() -> BTreeMap<&'static str, &'static str> {
    BTreeMap::from([
        ("1pm", "Portilla 1980; Westpfahl 1985; Damour 2016, arXiv:1609.00354"),
        ("2pm", "Westpfahl 1985, Fortsch. Phys. 33, 417; Bini & Damour 2017, arXiv:1706.06877; Damour 2018, arXiv:1710.10599"),
        ("3pm_conservative", "Bern, Cheung, Roiban, Shen, Solon, Zeng 2019, arXiv:1901.04424, 1908.01493; mass-polynomial form Damour 2019, arXiv:1912.02139"),
        ("3pm", "3PM conservative + radiation reaction of Damour 2020, arXiv:2010.01641; Di Vecchia, Heissenberg, Russo, Veneziano arXiv:2008.12743, 2101.05772"),
        ("chi_newtonian", "Kepler hyperbola tan(χ/2) = GM/(b v²) (Rutherford's formula with the gravitational coupling; Landau & Lifshitz, Mechanics, §19)"),
        ("chi_test_body", "exact Schwarzschild timelike geodesic by quadrature (Chandrasekhar 1983, The Mathematical Theory of Black Holes, ch. 3)"),
        ("test_body_pm", "generated in code by the finite-part expansion of the geodesic integral (encounter::testbody); checked against the exact quadrature"),
        ("j_critical_test_body", "unstable circular orbit of Schwarzschild (Misner, Thorne & Wheeler 1973, §25.5; Chandrasekhar 1983, ch. 3)"),
        ("chi_estimate", "strong-field resummed estimate (Damour 2018 arXiv:1710.10599, Damour & Rettegno 2023 arXiv:2211.01399)"),
        ("j_critical_estimate", "double root of the estimate's effective radial potential (unstable circular orbit of the resummed w(r); Damour 2018, arXiv:1710.10599)"),
        ("e_rad", "Herrmann, Parra-Martinez, Ruf, Zeng 2021, arXiv:2101.07255"),
        ("p_rad_cm", "Herrmann, Parra-Martinez, Ruf, Zeng 2021, arXiv:2101.07255"),
        ("j_rad", "Damour 2020, arXiv:2010.01641"),
        ("impulse", "Westpfahl 1985; Kosower, Maybee, O'Connell 2018, arXiv:1811.10950; longitudinal parts from the on-shell conditions (p_a + Δp_a)² = m_a²"),
    ])
}

/// Output key → citation, electromagnetic encounter.
pub(crate) fn electromagnetic() -> BTreeMap<&'static str, &'static str> {
    BTreeMap::from([
        ("1pl", "e₁ = −γ/p∞, from the expansion of Darwin's exact test-charge angle (Darwin 1913, Phil. Mag. 25, 201)"),
        ("2pl", "e₂ = π/(4h): Saketh, Vines, Steinhoff, Buonanno 2021, arXiv:2109.05994; Bern et al. 2023, arXiv:2305.08981"),
        ("3pl_conservative", "test-charge e₃ from the expansion of Darwin's angle (Darwin 1913); two-body ν dependence NOT included"),
        ("3pl", "plus radiation reaction by the linear-response formula of Damour 2020 (arXiv:2010.01641) applied to the Abraham–Lorentz–Dirac angular-momentum loss (derived in encounter::pl)"),
        ("chi_test_exact", "Darwin 1913; Landau & Lifshitz, Classical Theory of Fields §39 Problem 1"),
        ("e_rad", "test charge, leading order: the Liénard power (Jackson 1999, Classical Electrodynamics, 3rd ed., §14.2) along the straight line"),
        ("e_rad_dipole", "two-body non-relativistic electric dipole: the Larmor power (Jackson 1999, §14.2) along the straight lines"),
        ("j_rad", "Abraham–Lorentz–Dirac torque at O(e⁴) along the straight lines (derived in encounter::pl)"),
        ("impulse", "−p sin χ of the PL series and on-shell longitudinal parts (the construction of the gravitational impulse, encounter::impulse)"),
    ])
}
