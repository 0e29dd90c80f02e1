// Oxygen's compressibility from the reference equation of state of Schmidt R & Wagner W (1985),
// as given in Stewart RB, Jacobsen RT & Wagner W, "Thermodynamic properties of oxygen from the
// triple point to 300 K with pressures to 80 MPa", J Phys Chem Ref Data 1991;20:917.
// Only the residual Helmholtz energy is needed: Z = P/(ρRT) = 1 + δ·∂α_r/∂δ.
#pragma once

#include <string_view>

#include "model/result.hpp"
#include "model/units.hpp"

namespace firn::oxygen_eos {

using units::Pressure;
using units::Temperature;

// Range Firn uses it over (gas cylinders in the field): −50…+65 °C, 0.001…400 bar absolute. The
// equation itself is valid far wider; this range keeps the solver in the gas / supercritical
// region where it has one root. The 1 mbar floor keeps the density out of subnormal doubles,
// where the solver cannot converge and Z would be noise (fuzz finding, docs/hardening.md); a
// cylinder is never below the ambient pressure (≥ 150 hPa) anyway.
inline constexpr double min_temperature_c = -50.0, max_temperature_c = 65.0;
inline constexpr double min_pressure_bar = 0.001, max_pressure_bar = 400.0;

// The equation is published for the triple point to 300 K (Stewart, Jacobsen & Wagner 1991, the
// title): above 300 K (26.85 °C) Firn still computes, and says "extrapolated" (no "enough" from it).
inline constexpr double published_max_temperature_k = 300.0;
bool extrapolated(Temperature temperature);
inline constexpr std::string_view extrapolated_text =
    "above 300 K (26.85 \xC2\xB0" "C) the oxygen equation of state is extrapolated: it is published "
    "to 300 K (Stewart, Jacobsen & Wagner, J Phys Chem Ref Data 1991;20:917)";

// Constants of the equation (Stewart, Jacobsen & Wagner 1991).
inline constexpr double critical_temperature_k = 154.581;
inline constexpr double critical_density_mol_per_m3 = 13630.0;
inline constexpr double gas_constant_j_per_mol_k = 8.31434;
inline constexpr double molar_mass_kg_per_mol = 0.0319988;

struct State {
  double compressibility;       // Z = P/(ρRT)
  double molar_density_mol_per_m3;
  int iterations;               // Newton steps taken (bisection steps count too)
};

// Solves P(ρ, T) = P for ρ (Newton from the ideal-gas density, bisection as a fallback).
Result<State> state_at(Temperature temperature, Pressure absolute_pressure);

// Z alone, same range and errors.
Result<double> compressibility(Temperature temperature, Pressure absolute_pressure);

// The equation itself, for tests and for the solver: pressure (Pa) at a molar density and
// temperature. Programmer's contract: density ≥ 0, temperature > 0 (FIRN_ASSERT).
double pressure_pa(double molar_density_mol_per_m3, double temperature_k);

}  // namespace firn::oxygen_eos
