// Oxygen equation of state: Schmidt & Wagner (1985) residual Helmholtz form, Z(T, P).
#include <catch2/catch.hpp>

#include <array>
#include <cmath>

#include "model/oxygen_eos.hpp"
#include "sweep.hpp"

using namespace firn;
using namespace firn::units;
using namespace firn::oxygen_eos;

namespace {

double z_at(double celsius_value, double bar_absolute) {
  Result<double> z = compressibility(celsius(celsius_value), bar(bar_absolute));
  REQUIRE(z.ok());
  return z.value();
}

// Peng DY & Robinson DB, "A new two-constant equation of state", Ind Eng Chem Fundam
// 1976;15:59-64, with oxygen's Tc 154.581 K, Pc 5.043 MPa, ω 0.0222 (Stewart, Jacobsen & Wagner
// 1991). Solved here independently as the cubic's largest real root, to show the cubic is not
// good enough for cylinder contents.
double peng_robinson_z(double t_k, double p_pa) {
  const double tc = 154.581, pc = 5.043e6, omega = 0.0222, r = 8.31434;
  double kappa = 0.37464 + 1.54226 * omega - 0.26992 * omega * omega;
  double alpha = std::pow(1.0 + kappa * (1.0 - std::sqrt(t_k / tc)), 2.0);
  double a = 0.45724 * r * r * tc * tc / pc * alpha;
  double b = 0.07780 * r * tc / pc;
  double big_a = a * p_pa / (r * r * t_k * t_k), big_b = b * p_pa / (r * t_k);
  // Z³ − (1 − B)Z² + (A − 3B² − 2B)Z − (AB − B² − B³) = 0, Newton from Z = 1.
  double z = 1.0;
  for (int i = 0; i < 100; ++i) {
    double f = z * z * z - (1 - big_b) * z * z + (big_a - 3 * big_b * big_b - 2 * big_b) * z -
               (big_a * big_b - big_b * big_b - big_b * big_b * big_b);
    double df = 3 * z * z - 2 * (1 - big_b) * z + (big_a - 3 * big_b * big_b - 2 * big_b);
    z -= f / df;
  }
  return z;
}

}  // namespace

TEST_CASE("Z of oxygen reproduces every cell of the reference table", "[oxygen_eos]") {
  // Schmidt R & Wagner W (1985) oxygen equation of state, as given in Stewart RB, Jacobsen RT &
  // Wagner W, J Phys Chem Ref Data 1991;20:917: compressibility factor Z at absolute pressures.
  // Tolerance ±0.0005 (the table's last digit is 0.0001).
  const std::array<double, 7> temperatures_c{-40, -20, 0, 15, 20, 40, 60};
  struct Row {
    double bar_abs;
    std::array<double, 7> z;
  };
  const std::array<Row, 10> table{{
      {1.013, {0.9982, 0.9987, 0.9990, 0.9992, 0.9993, 0.9995, 0.9997}},
      {50, {0.9134, 0.9381, 0.9557, 0.9658, 0.9687, 0.9784, 0.9859}},
      {100, {0.8401, 0.8885, 0.9221, 0.9411, 0.9465, 0.9646, 0.9784}},
      {137, {0.8047, 0.8648, 0.9070, 0.9308, 0.9376, 0.9604, 0.9777}},
      {150, {0.7973, 0.8598, 0.9040, 0.9291, 0.9362, 0.9602, 0.9785}},
      {200, {0.7947, 0.8567, 0.9037, 0.9311, 0.9391, 0.9659, 0.9866}},
      {230, {0.8096, 0.8664, 0.9118, 0.9389, 0.9469, 0.9740, 0.9951}},
      {250, {0.8245, 0.8769, 0.9201, 0.9466, 0.9544, 0.9812, 1.0022}},
      {300, {0.8734, 0.9137, 0.9499, 0.9732, 0.9802, 1.0048, 1.0244}},
      {350, {0.9324, 0.9612, 0.9892, 1.0082, 1.0141, 1.0350, 1.0522}},
  }};
  double worst = 0.0;
  for (const Row& row : table) {
    for (std::size_t i = 0; i < temperatures_c.size(); ++i) {
      INFO("P = " << row.bar_abs << " bar, T = " << temperatures_c[i] << " °C");
      double z = z_at(temperatures_c[i], row.bar_abs);
      CHECK(z == Approx(row.z[i]).margin(0.0005));
      worst = std::max(worst, std::fabs(z - row.z[i]));
    }
  }
  // Measured when written: worst cell 0.00005 (rounding of the 4-decimal table).
  CHECK(worst < 0.0002);
}

TEST_CASE("the reference equation is not the ideal gas nor Peng-Robinson", "[oxygen_eos]") {
  // Z = 1 would overstate a 200 bar cylinder by ~7 % (table above: Z 0.9311 at 15 °C).
  double z200 = z_at(15, 200);
  CHECK(std::fabs(z200 - 1.0) > 0.05);
  // Peng-Robinson with oxygen's constants is ~2 % low at 200 bar, 15 °C (domain check value
  // Z 0.9105); the reference equation differs from it by more than the table tolerance.
  double pr = peng_robinson_z(288.15, 200e5);
  CHECK(pr == Approx(0.9105).margin(0.002));
  CHECK(z200 - pr > 0.015);
}

TEST_CASE("solver: density satisfies P(rho, T) and Z tends to 1 at low pressure",
          "[oxygen_eos][property]") {
  for (double t = min_temperature_c; t <= max_temperature_c; t += 5.0) {
    for (double p = 0.01; p <= max_pressure_bar; p *= 1.7) {
      Result<State> s = state_at(celsius(t), bar(p));
      REQUIRE(s.ok());
      CHECK(std::isfinite(s->compressibility));
      CHECK(s->iterations < 20);
      CHECK(pressure_pa(s->molar_density_mol_per_m3, t + 273.15) == Approx(p * 1e5).epsilon(1e-9));
    }
  }
  // Second virial behaviour: Z − 1 shrinks in proportion to pressure.
  double z_small = z_at(15, 0.01);
  CHECK(std::fabs(z_small - 1.0) < 1e-5);
  // Ideal-gas limit of the equation at 1 atm, 15 °C: molar volume ≈ RT/P = 23.645 L/mol.
  Result<State> atm = state_at(celsius(15), kilopascals(101.325));
  REQUIRE(atm.ok());
  CHECK(1.0 / atm->molar_density_mol_per_m3 * 1000.0 == Approx(23.645 * atm->compressibility).epsilon(1e-4));
}

TEST_CASE("outside -50...+65 °C or 0...400 bar is an error naming range and unit",
          "[oxygen_eos][errors]") {
  Result<double> cold = compressibility(celsius(-60), bar(100));
  REQUIRE_FALSE(cold.ok());
  CHECK(cold.error().message == "oxygen temperature must be between -50 and 65 °C (got -60 °C)");
  Result<double> high = compressibility(celsius(15), bar(450));
  REQUIRE_FALSE(high.ok());
  CHECK(high.error().message.find("between 0.001 and 400 bar") != std::string::npos);
  CHECK_FALSE(compressibility(celsius(15), bar(0)).ok());
  CHECK_FALSE(compressibility(celsius(15), bar(-3)).ok());
  CHECK_FALSE(compressibility(celsius(NAN), bar(100)).ok());
  CHECK_FALSE(compressibility(celsius(15), bar(INFINITY)).ok());
}

TEST_CASE("sweep: Z and density over −50…+65 °C and 0.001…400 bar", "[oxygen_eos][sweep]") {
  // Z stays plausible for a gas (the equation gives 0.75 at −50 °C near 200 bar and 1.09 at
  // +65 °C, 400 bar), the density rises with pressure, and the solver converges everywhere,
  // down to the 1 mbar floor.
  for (double t : sweep::grid(min_temperature_c, max_temperature_c, 23)) {
    double previous = 0.0;
    for (double p : sweep::grid(min_pressure_bar, max_pressure_bar, 200)) {
      Result<State> s = state_at(celsius(t), bar(p));
      REQUIRE(s.ok());
      CHECK(s->compressibility > 0.7);
      CHECK(s->compressibility < 1.15);
      CHECK(s->molar_density_mol_per_m3 > previous);
      previous = s->molar_density_mol_per_m3;
    }
  }
}

TEST_CASE("sweep: just outside the EOS range the message names it", "[oxygen_eos][sweep][errors]") {
  CHECK_REFUSED_NAMING(state_at(celsius(-50.01), bar(100)), "between -50 and 65 °C");
  CHECK_REFUSED_NAMING(state_at(celsius(65.01), bar(100)), "between -50 and 65 °C");
  CHECK_REFUSED_NAMING(state_at(celsius(15), bar(400.01)), "between 0.001 and 400 bar");
  // Fuzz finding: a subnormal pressure (5e-324 bar) passed "above 0" and the solver's assert
  // fired (no convergence). The range now starts at 1 mbar.
  CHECK_REFUSED_NAMING(state_at(celsius(15), bar(0.00099)), "between 0.001 and 400 bar");
  CHECK_REFUSED_NAMING(state_at(celsius(65), bar(4.9406564584124654e-324)), "between 0.001 and 400 bar");
}

TEST_CASE("above the published 300 K the equation is marked extrapolated", "[oxygen_eos]") {
  // Stewart RB, Jacobsen RT & Wagner W, "Thermodynamic properties of oxygen from the triple point
  // to 300 K with pressures to 80 MPa", J Phys Chem Ref Data 1991;20:917: published to 300 K.
  CHECK(oxygen_eos::published_max_temperature_k == 300.0);
  CHECK_FALSE(oxygen_eos::extrapolated(kelvin(300.0)));
  CHECK_FALSE(oxygen_eos::extrapolated(celsius(-40)));
  CHECK(oxygen_eos::extrapolated(kelvin(300.01)));
  CHECK(oxygen_eos::extrapolated(celsius(60)));
  CHECK(std::string(oxygen_eos::extrapolated_text).find("published to 300 K") != std::string::npos);
}
