// Package aqueous owns the activity-coefficient models of aqueous electrolyte
// solutions and the properties of liquid water they need: its density and
// relative permittivity as functions of temperature, the Debye–Hückel
// parameters A and B derived from them, ionic strength, the activity
// coefficients of ions and neutral solutes, and the activity of water.
//
// Everything is a value or a pure function. The package never reads files,
// never knows networks or species names, and never extrapolates a
// correlation outside the range it was published for: it returns a
// *RangeError instead, and leaves the diagnostic to the caller.
//
// Units: temperature in K, molality and ionic strength in mol/kg, ion-size
// parameters å in Å (the unit of every published tabulation), water density in
// kg/m³. Activity coefficients are returned as log10 γ, the form in which the
// models are published.
package aqueous
