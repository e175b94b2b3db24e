// Package equilibrium computes what a compiled network gives at a
// temperature, pressure or composition: a reaction's K(T) table with its
// kind (Kp, Kc, Ksp or K), its quotient written out, the span its data
// cover and the temperatures where ΔrG° changes sign (table.go,
// quotient.go); a mixture's approach to equilibrium, reaction by reaction:
// Q, K, ΔrG, the direction it would run and the temperature at which K
// would equal Q, with the solution's ionic strength and activity
// coefficients (approach.go, solution.go); a feed brought to chemical
// equilibrium by minimising its Gibbs energy through package gibbs, over
// the network's reactions or over every species and the element balance,
// with the heat it takes and the adiabatic temperature (system.go,
// composition.go, heat.go, adiabatic.go); and the equilibrium of an
// aqueous system with the network's activity model: speciation, pH, ionic
// strength, γ, minerals' saturation indices and what fixed gases exchange
// (aqueous*.go).
//
// It builds on network's evaluation of one reaction (network.ReactionK) and
// a mixture's activities and amounts (network.Mixture), which the checks
// share. It never reads or compiles a file and never decides whether a
// network is sound: a mixture the checks reject gives no numbers here, and
// a feed that cannot be brought to equilibrium comes back as diagnostics
// for the caller to report. network never imports it.
package equilibrium
