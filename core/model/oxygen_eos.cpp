#include "model/oxygen_eos.hpp"

#include <array>
#include <cmath>

namespace firn::oxygen_eos {
namespace {

using namespace units;

// Schmidt & Wagner (1985) residual Helmholtz energy, as given in Stewart, Jacobsen & Wagner,
// J Phys Chem Ref Data 1991;20:917:
//   α_r = Σ1..13 n δ^d τ^t + Σ14..24 n δ^d τ^t e^(−δ²) + Σ25..32 n δ^d τ^t e^(−δ⁴)
struct Term {
  double n;
  int d;
  double t;
  int c;  // exponent of δ in the exponential, 0 for none
};

constexpr std::array<Term, 32> kTerms{{
    {0.3983768749, 1, 0.0, 0},
    {-1.846157454, 1, 1.5, 0},
    {0.4183473197, 1, 2.5, 0},
    {0.02370620711, 2, -0.5, 0},
    {0.09771730573, 2, 1.5, 0},
    {0.03017891294, 2, 2.0, 0},
    {0.02273353212, 3, 0.0, 0},
    {0.01357254086, 3, 1.0, 0},
    {-0.04052698943, 3, 2.5, 0},
    {0.0005454628515, 6, 0.0, 0},
    {0.0005113182277, 7, 2.0, 0},
    {2.953466883e-07, 7, 5.0, 0},
    {-8.687645072e-05, 8, 2.0, 0},
    {-0.2127082589, 1, 5.0, 2},
    {0.08735941958, 1, 6.0, 2},
    {0.127550919, 2, 3.5, 2},
    {-0.09067701064, 2, 5.5, 2},
    {-0.03540084206, 3, 3.0, 2},
    {-0.03623278059, 3, 7.0, 2},
    {0.0132769929, 5, 6.0, 2},
    {-0.0003254111865, 6, 8.5, 2},
    {-0.008313582932, 7, 4.0, 2},
    {0.002124570559, 8, 6.5, 2},
    {-0.0008325206232, 10, 5.5, 2},
    {-2.626173276e-05, 2, 22.0, 4},
    {0.002599581482, 3, 11.0, 4},
    {0.009984649663, 3, 18.0, 4},
    {0.002199923153, 4, 11.0, 4},
    {-0.02591350486, 4, 23.0, 4},
    {-0.1259630848, 5, 17.0, 4},
    {0.1478355637, 5, 18.0, 4},
    {-0.01011251078, 5, 23.0, 4},
}};

// δ·∂α_r/∂δ and its derivative with respect to δ (for Newton's method).
struct DeltaDerivative {
  double value;
  double slope;
};

DeltaDerivative delta_alpha_delta(double delta, double tau) {
  DeltaDerivative sum{0.0, 0.0};
  for (const Term& k : kTerms) {
    double a = k.n * std::pow(tau, k.t);
    double dd = std::pow(delta, k.d);  // δ^d
    if (k.c == 0) {
      // δ·∂(δ^d)/∂δ = d·δ^d
      sum.value += a * k.d * dd;
      sum.slope += a * k.d * k.d * dd / delta;
    } else {
      // f = (d·δ^d − c·δ^(d+c))·e^(−δ^c)
      double dc = std::pow(delta, k.c);
      double e = std::exp(-dc);
      double g = k.d * dd - k.c * dd * dc;
      double g_slope = (k.d * k.d * dd - k.c * (k.d + k.c) * dd * dc) / delta;
      sum.value += a * g * e;
      sum.slope += a * (g_slope - g * k.c * dc / delta) * e;
    }
  }
  return sum;
}

constexpr double kR = gas_constant_j_per_mol_k;
constexpr double kRhoC = critical_density_mol_per_m3;
constexpr double kTc = critical_temperature_k;

// P(ρ) and dP/dρ at temperature T.
struct PressureSlope {
  double p;
  double dp_drho;
};

PressureSlope pressure_and_slope(double rho, double t) {
  double delta = rho / kRhoC;
  DeltaDerivative r = delta_alpha_delta(delta, kTc / t);
  double p = rho * kR * t * (1.0 + r.value);
  // d/dρ [ρ(1 + f(δ))] = 1 + f + δ·f'(δ)
  double dp = kR * t * (1.0 + r.value + delta * r.slope);
  return {p, dp};
}

}  // namespace

bool extrapolated(Temperature temperature) {
  return temperature.in(kelvin) > published_max_temperature_k;
}

double pressure_pa(double rho, double t) {
  FIRN_ASSERT(rho >= 0.0 && t > 0.0, "oxygen_eos::pressure_pa needs ρ ≥ 0 and T > 0");
  if (rho == 0.0) return 0.0;
  return pressure_and_slope(rho, t).p;
}

Result<State> state_at(Temperature temperature, Pressure absolute_pressure) {
  double t_c = temperature.in(celsius);
  if (!in_range(t_c, min_temperature_c, max_temperature_c)) {
    return range_error("oxygen temperature", min_temperature_c, max_temperature_c, "°C", t_c);
  }
  double p_bar = absolute_pressure.in(bar);
  if (!in_range(p_bar, min_pressure_bar, max_pressure_bar)) {
    return range_error("oxygen pressure (absolute)", min_pressure_bar, max_pressure_bar, "bar",
                       p_bar);
  }
  double t = temperature.in(kelvin);
  double p = absolute_pressure.in(pascals);

  // In this range (T > 1.45·Tc) the isotherm P(ρ) rises monotonically from 0 through 400 bar,
  // so one root lies in [0, ρ_max]; ρ_max = 3 × the ideal density is well beyond it (Z > 0.7).
  double low = 0.0, high = 3.0 * p / (kR * t);
  double rho = p / (kR * t);  // ideal-gas start
  int iterations = 0;
  constexpr int kMaxIterations = 100;
  constexpr double kRelativeTolerance = 1e-12;
  bool converged = false;
  while (iterations < kMaxIterations) {
    ++iterations;
    PressureSlope ps = pressure_and_slope(rho, t);
    double residual = ps.p - p;
    if (std::fabs(residual) <= kRelativeTolerance * p) {
      converged = true;
      break;
    }
    if (residual > 0.0) high = rho; else low = rho;
    double next = ps.dp_drho > 0.0 ? rho - residual / ps.dp_drho : NAN;
    // Newton step leaving the bracket (or a bad slope): bisect instead.
    if (!std::isfinite(next) || next <= low || next >= high) next = 0.5 * (low + high);
    rho = next;
  }
  double z = p / (rho * kR * t);
  FIRN_ASSERT(converged && std::isfinite(z), "oxygen EOS solver did not converge in range");
  return State{z, rho, iterations};
}

Result<double> compressibility(Temperature temperature, Pressure absolute_pressure) {
  Result<State> s = state_at(temperature, absolute_pressure);
  if (!s) return s.error();
  return s->compressibility;
}

}  // namespace firn::oxygen_eos
