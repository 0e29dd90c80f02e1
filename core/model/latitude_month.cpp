#include "model/latitude_month.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>

namespace firn::atmosphere {
namespace {

using namespace units;

constexpr int kLatitudeNodes = 37;      // −90…90 every 5°
constexpr double kLatitudeStepDeg = 5.0;
constexpr int kAltitudeNodes = 10;      // 0…9000 m every 1000 m
constexpr double kAltitudeStepM = 1000.0;
constexpr double kRatioScale = 1e5;

// NRLMSISE-00 / West 1996 × 1e5; rows (month − 1)·37 + latitude index, columns altitude index.
// Read only at compile time: the program keeps each value less kRatioOffset in 16 bits (every
// value lies in 60000…125535, checked at compile time), half the bytes of the table in the page.
constexpr int kRows = 12 * kLatitudeNodes;
constexpr std::int32_t kRatioTable[kRows][kAltitudeNodes] = {
#include "model/latitude_month_table.inc"
};
constexpr std::int32_t kRatioOffset = 60000;

constexpr bool fits_16_bits() {
  for (const auto& row : kRatioTable) {
    for (std::int32_t value : row) {
      if (value < kRatioOffset || value - kRatioOffset > 0xFFFF) return false;
    }
  }
  return true;
}
static_assert(fits_16_bits(), "a latitude table value does not fit 16 bits above kRatioOffset");

struct PackedRatios {
  std::uint16_t values[kRows][kAltitudeNodes];
};
constexpr PackedRatios pack_ratios() {
  PackedRatios packed{};
  for (int r = 0; r < kRows; ++r) {
    for (int a = 0; a < kAltitudeNodes; ++a) {
      packed.values[r][a] = static_cast<std::uint16_t>(kRatioTable[r][a] - kRatioOffset);
    }
  }
  return packed;
}
constexpr PackedRatios kRatio = pack_ratios();

double table_ratio(int month, int lat_index, int alt_index) {
  return (kRatio.values[(month - 1) * kLatitudeNodes + lat_index][alt_index] + kRatioOffset) / kRatioScale;
}

// Linear between nodes in latitude and altitude (the ratio is smooth in both; within 0.1 % of
// the model, docs/atmosphere.md). The month is not interpolated: each is its mid-month state.
double ratio_to_west(double z_m, const LatitudeMonth& where) {
  double lat_pos = (where.latitude_deg - kLatitudeLowDeg) / kLatitudeStepDeg;
  int i = std::clamp(static_cast<int>(std::floor(lat_pos)), 0, kLatitudeNodes - 2);
  double t = lat_pos - i;
  double alt_pos = z_m / kAltitudeStepM;
  int j = std::clamp(static_cast<int>(std::floor(alt_pos)), 0, kAltitudeNodes - 2);
  double u = alt_pos - j;
  double low = table_ratio(where.month, i, j) * (1 - t) + table_ratio(where.month, i + 1, j) * t;
  double high =
      table_ratio(where.month, i, j + 1) * (1 - t) + table_ratio(where.month, i + 1, j + 1) * t;
  return low * (1 - u) + high * u;
}

}  // namespace

Result<LatitudeMonth> make_latitude_month(double latitude_deg, double month) {
  if (!in_range(latitude_deg, kLatitudeLowDeg, kLatitudeHighDeg)) {
    return range_error("latitude", kLatitudeLowDeg, kLatitudeHighDeg, "° (north +, south \xE2\x88\x92)",
                       latitude_deg);
  }
  if (!in_range(month, kFirstMonth, kLastMonth) || month != std::floor(month)) {
    Error e{"month must be a whole number from 1 (January) to 12 (December)"};
    e.message += std::isfinite(month) ? " (got " + format_number(month, 2) + ")"
                                      : std::string(got_not_a_number);
    return e;
  }
  return LatitudeMonth{latitude_deg, static_cast<int>(month)};
}

std::string_view latitude_month_model_name() { return "NRLMSISE-00"; }

units::Range<units::LengthDimension> latitude_month_altitude_range() {
  return {metres(0.0), metres((kAltitudeNodes - 1) * kAltitudeStepM), &metres, "altitude",
          " for the latitude and month figures (NRLMSISE-00)"};
}

units::Range<units::PressureDimension> pressure_range(const LatitudeMonth& where) {
  units::Range<units::LengthDimension> z = latitude_month_altitude_range();
  return {hectopascals(std::ceil(pressure_at(z.high, where)->in(hectopascals) * 10) / 10),
          hectopascals(std::floor(pressure_at(z.low, where)->in(hectopascals) * 10) / 10),
          &hectopascals, "pressure", " for NRLMSISE-00 at this latitude and month"};
}

AltitudeRange latitude_month_altitudes() {
  units::Range<units::LengthDimension> r = latitude_month_altitude_range();
  return {r.low_in_unit(), r.high_in_unit()};
}

Result<Pressure> pressure_at(Length geometric_altitude, const LatitudeMonth& where) {
  if (auto a = check(geometric_altitude, latitude_month_altitude_range()); !a) return a.error();
  double z = geometric_altitude.in(metres);
  FIRN_ASSERT(make_latitude_month(where.latitude_deg, where.month).ok(),
              "LatitudeMonth not made by make_latitude_month");
  Result<Pressure> west = pressure_at(geometric_altitude, Model::West1996);
  if (!west) return west.error();
  return west.value() * ratio_to_west(z, where);
}

Result<Length> altitude_at(Pressure pressure, const LatitudeMonth& where) {
  AltitudeRange range = latitude_month_altitudes();
  double low_hpa = pressure_at(metres(range.high_m), where)->in(hectopascals);
  double high_hpa = pressure_at(metres(range.low_m), where)->in(hectopascals);
  double hpa = pressure.in(hectopascals);
  // Exact bounds; the published range (inside them) names the refusal.
  if (!in_range(hpa, low_hpa, high_hpa)) return refused(pressure, pressure_range(where));
  // Pressure falls monotonically with altitude: bisection to well under a metre.
  double low_m = range.low_m, high_m = range.high_m;
  for (int k = 0; k < 50; ++k) {
    double mid = 0.5 * (low_m + high_m);
    if (pressure_at(metres(mid), where)->in(hectopascals) > hpa) low_m = mid;
    else high_m = mid;
  }
  return metres(0.5 * (low_m + high_m));
}

Result<Pressure> pressure_at(Length geometric_altitude, Model model,
                             const std::optional<LatitudeMonth>& where) {
  if (where) return pressure_at(geometric_altitude, *where);
  return pressure_at(geometric_altitude, model);
}

Result<PressureEnvelope> climatological_envelope(Length geometric_altitude) {
  if (auto a = check(geometric_altitude, latitude_month_altitude_range()); !a) return a.error();
  double z = geometric_altitude.in(metres);
  double low = 1e9, high = 0.0;
  for (int month = kFirstMonth; month <= kLastMonth; ++month) {
    for (int i = 0; i < kLatitudeNodes; ++i) {
      double r = ratio_to_west(z, LatitudeMonth{kLatitudeLowDeg + i * kLatitudeStepDeg, month});
      low = std::min(low, r);
      high = std::max(high, r);
    }
  }
  Pressure west = pressure_at(geometric_altitude, Model::West1996).value();
  return PressureEnvelope{west * low, west * high};
}

}  // namespace firn::atmosphere
