// Package thermo holds the numbers of hess: physical constants, units and
// quantities, species thermodynamic models with their valid ranges and the exact
// extremes of a polynomial range's Cp°, H° and S°, reaction
// sums and equilibrium constants, crossover root searches, uncertainty
// propagation and Arrhenius rates with their least-squares fit.
//
// Everything inside the package is SI: J/mol, J/(mol·K), K, Pa, mol/m³.
// Units convert at the edges through ParseUnit and Quantity.
package thermo
