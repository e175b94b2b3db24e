// Package gibbs finds the equilibrium composition of a chemical system at
// fixed temperature and pressure by minimising its Gibbs energy.
//
// It owns the numerical core only: a Problem is dimensionless numbers (each
// species' μ°/RT at the problem's temperature, P/p°, the conservation matrix
// and the feed) and Solve returns the amounts that minimise G/RT subject to
// B·n = B·n₀ and n ≥ 0. It never reads a network, a file or a unit, and never
// converts a temperature or a pressure: its caller does.
//
// Phases: ideal gas (activity y·P/p°), pure condensed phases (activity 1,
// present or absent), ideal solutions (activity = mole fraction) and aqueous
// phases (a solvent and dilute solutes with activity m/(1 mol/kg); the
// solvent's activity follows from Gibbs–Duhem, ln a_w = −M_w Σ m_j). Optional
// activity coefficients enter through Problem.LnGamma, solved by an outer
// fixed-point loop. A species may be held at a fixed activity (an open
// system): its amount is the signed amount taken from a reservoir.
//
// Conservation is either element (and charge) rows — full Gibbs minimisation —
// or, for a reaction network, a basis of the left null space of the
// stoichiometric matrix (ReactionsConservation), so that n ∈ n₀ + range(N)
// exactly. Both go through the one solver.
//
// Method. The element-potential (Lagrange multiplier) form of Newton's method
// for Gibbs minimisation: the RAND method of White, Johnson and Dantzig
// (J. Chem. Phys. 28, 751, 1958) in the log-amount form of Gordon and McBride
// (NASA RP-1311, 1994, ch. 2), generalised to several mixture phases (one
// Δln Nₚ per phase, the aqueous solvent's row from Gibbs–Duhem) and to pure
// condensed phases by the active-set rule of Smith and Missen (Chemical
// Reaction Equilibrium Analysis, 1982, ch. 6 and 9): a pure phase is present
// while its amount stays positive and is added when μ°_k − Σ_i B_ik λ_i < 0;
// an ideal mixture phase is absent while Σ_j exp(Σ_i B_ij λ_i − μ°_j) ≤ 1.
// Each Newton step solves a reduced symmetric system in the potentials λ, one
// Δln Nₚ per present mixture phase and one Δn per present pure phase, of size
// rows + phases, not species. Mixture species are carried as ln n, so trace
// species (mole fractions of 1e-30 and below) come out to full relative
// precision; the step is damped as Gordon and McBride do (major species move
// at most e² per step, minor species may fall freely but rise only to 1e-4).
// Species the constraints force to exactly zero (an element absent from the
// feed, a species no reaction can make from the feed) are found first by
// linear programming (gonum's simplex) and removed, and come out exactly 0.
//
// Robustness: the potentials are solved as corrections to the current ones,
// so the right-hand side is the small stationarity residual and trace
// species keep their precision. A cold start holds the pure phases the feed
// could form, no more than the phase rule allows, independent (a dependent
// one enters by an exchange, like a simplex pivot); a start that wanders is
// abandoned for one with only the feed's pure phases. Mixture phases that
// cannot coexist (two phases of one species off their transition) give an
// inconsistent step: the smaller leaves. Phases that come and go at rounding
// level three times are held out unless clearly unstable. Iterations are
// bounded; a solve that misses its tolerances says so (Converged false, with
// its residuals), never silently.
package gibbs
