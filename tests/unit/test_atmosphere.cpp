// Atmosphere: ISA (geometric → geopotential), West 1996, QNH and hypsometric pressure.
#include <catch2/catch.hpp>

#include <cmath>

#include "model/atmosphere.hpp"
#include "model/latitude_month.hpp"
#include "sweep.hpp"

using namespace firn;
using namespace firn::units;
using namespace firn::atmosphere;

namespace {
double isa_hpa(double metres_value) {
  return pressure_at(metres(metres_value), Model::Isa)->in(hectopascals);
}
double west_torr(double metres_value) {
  return pressure_at(metres(metres_value), Model::West1996)->in(torr);
}
}  // namespace

TEST_CASE("ISA pressure at geometric altitudes", "[atmosphere]") {
  // U.S. Standard Atmosphere 1976 (NOAA/NASA/USAF), Table I, indexed by geometric altitude Z.
  CHECK(isa_hpa(0) == Approx(1013.25).margin(0.005));
  CHECK(isa_hpa(1000) == Approx(898.76).margin(0.01));
  CHECK(isa_hpa(3000) == Approx(701.21).margin(0.01));
  CHECK(isa_hpa(5000) == Approx(540.48).margin(0.02));  // USSA 1976 Table I: 5.4048e2 mb
  CHECK(isa_hpa(-500) == Approx(1074.78).margin(0.02));  // USSA 1976 Table I: 1.0748e3 mb
  CHECK(isa_hpa(20000) == Approx(55.29).margin(0.02));  // USSA 1976 Table I: 5.5293e1 mb
}

TEST_CASE("ISA is defined on geopotential height", "[atmosphere]") {
  // ICAO Doc 7488/3 (1993), Manual of the ICAO Standard Atmosphere: tropopause at 11 000 m
  // geopotential, 226.32 hPa.
  double z = geometric_from_geopotential_m(11000.0);
  CHECK(z == Approx(11019.1).margin(0.1));
  CHECK(isa_hpa(z) == Approx(226.32).margin(0.01));
  CHECK(geopotential_from_geometric_m(geometric_from_geopotential_m(8000.0)) ==
        Approx(8000.0).margin(1e-6));
}

TEST_CASE("West 1996 mountain model", "[atmosphere]") {
  // West JB, J Appl Physiol 1996;81:1850-1854, model-atmosphere table at 15° latitude. The
  // closed-form equation is the paper's fit to that table; they agree within 1 Torr.
  CHECK(west_torr(4000) == Approx(475).margin(1.0));
  CHECK(west_torr(5000) == Approx(419).margin(1.0));
  CHECK(west_torr(6000) == Approx(369).margin(1.0));
  // Measured on the Everest summit (8848 m): 253 Torr (West et al., J Appl Physiol
  // 1983;54:1188-1194). The model predicts it within 1 Torr.
  CHECK(west_torr(8848) == Approx(253).margin(1.0));
  // West's model gives higher pressures than ISA at altitude (same paper, discussion).
  CHECK(west_torr(6000) > pressure_at(metres(6000), Model::Isa)->in(torr));
}

TEST_CASE("inverse of each model returns the altitude within 0.1 m", "[atmosphere][property]") {
  for (Model model : {Model::Isa, Model::West1996}) {
    AltitudeRange range = valid_altitudes(model);
    for (double z = range.low_m; z <= range.high_m; z += 37.0) {
      Result<Pressure> p = pressure_at(metres(z), model);
      REQUIRE(p.ok());
      Result<Length> back = altitude_at(p.value(), model);
      REQUIRE(back.ok());
      CHECK(back->in(metres) == Approx(z).margin(0.1));
    }
  }
}

TEST_CASE("pressure falls monotonically with altitude", "[atmosphere][property]") {
  for (Model model : {Model::Isa, Model::West1996}) {
    AltitudeRange range = valid_altitudes(model);
    double previous = INFINITY;
    for (double z = range.low_m; z <= range.high_m; z += 10.0) {
      double p = pressure_at(metres(z), model)->in(pascals);
      CHECK(p < previous);
      previous = p;
    }
  }
}

TEST_CASE("out-of-range and non-finite altitudes are errors naming range and unit",
          "[atmosphere][errors]") {
  Result<Pressure> high = pressure_at(metres(25000), Model::Isa);
  REQUIRE_FALSE(high.ok());
  CHECK(high.error().message ==
        "altitude must be between -500 and 20000 m (got 25000 m) for the ISA model");
  Result<Pressure> west_high = pressure_at(metres(9500), Model::West1996);
  REQUIRE_FALSE(west_high.ok());
  CHECK(west_high.error().message.find("between 0 and 9000 m") != std::string::npos);
  CHECK_FALSE(pressure_at(metres(NAN), Model::Isa).ok());
  CHECK_FALSE(pressure_at(metres(INFINITY), Model::West1996).ok());
  Result<Length> low_p = altitude_at(hectopascals(10), Model::Isa);
  REQUIRE_FALSE(low_p.ok());
  CHECK(low_p.error().message.find("hPa") != std::string::npos);
  CHECK_FALSE(altitude_at(hectopascals(NAN), Model::West1996).ok());
}

TEST_CASE("pressure from QNH", "[atmosphere][qnh]") {
  // With QNH = 1013.25 hPa the altimeter convention reproduces ISA (ICAO Doc 8168, altimeter
  // setting procedures: QNH makes the altimeter read elevation on the ground).
  CHECK(pressure_from_qnh(metres(3000), hectopascals(1013.25))->in(hectopascals) ==
        Approx(isa_hpa(3000)).margin(0.001));
  // Scales with QNH (same formula): a low of 990 hPa at 3000 m.
  CHECK(pressure_from_qnh(metres(3000), hectopascals(990))->in(hectopascals) ==
        Approx(isa_hpa(3000) * 990 / 1013.25).margin(0.001));
  // Hypsometric form with the ISA sea-level temperature (15 °C) matches ISA within 0.05 hPa:
  // the layer-mean temperature is exact for a linear lapse to first order.
  CHECK(pressure_from_qnh(metres(3000), hectopascals(1013.25), celsius(15), TemperatureAt::SeaLevel)
            ->in(hectopascals) == Approx(isa_hpa(3000)).margin(0.5));
  // A colder day means a lower pressure aloft (AMS Glossary, hypsometric equation).
  double cold = pressure_from_qnh(metres(3000), hectopascals(1013.25), celsius(-10),
                                  TemperatureAt::SeaLevel)->in(hectopascals);
  CHECK(cold < isa_hpa(3000) - 5.0);
  // Station temperature of −4.5 °C at 3000 m is the ISA temperature there: same as ISA.
  CHECK(pressure_from_qnh(metres(3000), hectopascals(1013.25), celsius(15 - 0.0065 * 2998.585),
                          TemperatureAt::Station)->in(hectopascals) == Approx(isa_hpa(3000)).margin(0.5));
  CHECK_FALSE(pressure_from_qnh(metres(3000), hectopascals(500)).ok());
  CHECK_FALSE(pressure_from_qnh(metres(3000), hectopascals(1013), celsius(90), TemperatureAt::Station).ok());
}

TEST_CASE("QNH with a temperature says what it cannot know", "[atmosphere][qnh]") {
  // ICAO Doc 8168 (altimeter setting procedures): QNH is the station pressure reduced to sea level
  // with the standard atmosphere, so from that station the standard-lapse formula returns the
  // station pressure exactly, whatever the temperature. Round trip: 690 hPa at 3000 m.
  double ratio = isa_hpa(3000) / 1013.25;
  double qnh = 690.0 / ratio;
  CHECK(pressure_from_qnh(metres(3000), hectopascals(qnh))->in(hectopascals) ==
        Approx(690.0).margin(1e-6));
  // With a cold station temperature the hypsometric figure treats QNH as a true sea-level
  // pressure and comes out lower (AMS Glossary, hypsometric equation): both are kept and the note
  // says which applies when.
  QnhWithTemperature cold = qnh_with_temperature(metres(3000), hectopascals(qnh), celsius(-25),
                                                 TemperatureAt::Station).value();
  CHECK(cold.standard_lapse.in(hectopascals) == Approx(690.0).margin(1e-6));
  CHECK(cold.with_temperature.in(hectopascals) < 690.0 - 3.0);
  CHECK_THAT(cold.note, Catch::Contains("standard-atmosphere reduction, not a true sea-level pressure"));
  CHECK_THAT(cold.note, Catch::Contains("standard-lapse figure (690 hPa)"));
  // The error grows with the station's height and the cold (hypsometric equation): the same
  // 20 K below the ISA temperature (15 °C − 6.5 K/km) at a higher station, or colder still.
  auto gap = [](double z, double below_isa_k) {
    double isa_c = 15.0 - 0.0065 * geopotential_from_geometric_m(z);
    QnhWithTemperature q = qnh_with_temperature(metres(z), hectopascals(1013.25),
                                                celsius(isa_c - below_isa_k), TemperatureAt::Station)
                               .value();
    return std::fabs(q.with_temperature.in(hectopascals) - q.standard_lapse.in(hectopascals));
  };
  CHECK(gap(4000, 20) > gap(2000, 20));
  CHECK(gap(4000, 30) > gap(4000, 20));
  CHECK(gap(4000, 0) < 0.5);  // at the ISA temperature the two agree
  CHECK_FALSE(qnh_with_temperature(metres(3000), hectopascals(1013), celsius(90), TemperatureAt::Station).ok());
}

TEST_CASE("a station reading is checked against a known altitude", "[atmosphere][station]") {
  // Issue 11 §6 rule: above 950 hPa with a known altitude over 1,500 m is a sea-level figure.
  StationCheck qnh_typed = check_station_reading(hectopascals(1013), metres(3000), Model::West1996).value();
  CHECK(qnh_typed.verdict == ReadingCheck::LooksLikeSeaLevel);
  CHECK_THAT(qnh_typed.message, Catch::Contains("probably a sea-level figure"));
  CHECK(check_station_reading(hectopascals(955), metres(1600), Model::West1996)->verdict ==
        ReadingCheck::LooksLikeSeaLevel);
  // ISA at 3000 m is 701.2 hPa (USSA 1976 Table I): consistent, and its pressure altitude by ISA
  // is the altitude itself.
  StationCheck isa = check_station_reading(hectopascals(701.21), metres(3000), Model::Isa).value();
  CHECK(isa.verdict == ReadingCheck::Consistent);
  REQUIRE(isa.pressure_altitude_known);
  CHECK(isa.pressure_altitude.in(metres) == Approx(3000).margin(1));
  // 60°N in January at 5 km, 511.5 hPa (NRLMSISE-00, python3-fluids): a real reading, consistent.
  CHECK(check_station_reading(hectopascals(511.5), metres(5000), Model::West1996)->verdict ==
        ReadingCheck::Consistent);
  // ISA at 5000 m (540.5 hPa) typed for a 3000 m camp: no latitude or month gives that.
  StationCheck wrong = check_station_reading(hectopascals(540.5), metres(3000), Model::West1996).value();
  CHECK(wrong.verdict == ReadingCheck::Mismatch);
  CHECK_THAT(wrong.message, Catch::Contains("do not agree"));
  // Sea level with a sea-level reading is fine.
  CHECK(check_station_reading(hectopascals(1013), metres(0), Model::West1996)->verdict ==
        ReadingCheck::Consistent);
  CHECK_FALSE(check_station_reading(hectopascals(50), metres(3000), Model::West1996).ok());
  CHECK_REFUSED_NAMING(check_station_reading(hectopascals(700), metres(9500), Model::West1996),
                       "between 0 and 9000 m");
}

TEST_CASE("a station reading is PB itself", "[atmosphere]") {
  CHECK(pressure_from_station_reading(hectopascals(616))->in(hectopascals) == 616.0);
  CHECK_FALSE(pressure_from_station_reading(hectopascals(50)).ok());
}

TEST_CASE("model names and keys", "[atmosphere]") {
  CHECK(parse_model("isa").value() == Model::Isa);
  CHECK(parse_model("west").value() == Model::West1996);
  CHECK_FALSE(parse_model("mars").ok());
  CHECK(model_name(default_medical_model) == "West 1996");
}

TEST_CASE("sweep: pressures to altitudes, QNH and station readings over their whole ranges",
          "[atmosphere][sweep]") {
  // pressure_at over each model's range: see the inverse and monotonic cases above. Here the
  // other direction, from every pressure the model covers (ISA 55.3…1074.7, West 330…1012.6
  // with the corrected constant 6.63268: 329.92…1012.63 hPa).
  for (Model model : {Model::Isa, Model::West1996}) {
    AltitudeRange range = valid_altitudes(model);
    double low_hpa = pressure_at(metres(range.high_m), model)->in(hectopascals);
    double high_hpa = pressure_at(metres(range.low_m), model)->in(hectopascals);
    double previous = INFINITY;
    for (double hpa : sweep::grid(low_hpa, high_hpa, 500)) {
      Result<Length> z = altitude_at(hectopascals(hpa), model);
      REQUIRE(z.ok());
      CHECK(z->in(metres) >= range.low_m - 1e-6);
      CHECK(z->in(metres) <= range.high_m + 1e-6);
      CHECK(z->in(metres) < previous);  // higher pressure, lower altitude
      previous = z->in(metres);
    }
  }
  // QNH 900…1100 hPa, altitude −500…9000 m, air temperature −60…+50 °C at sea level or station.
  for (double qnh : sweep::grid(900, 1100, 8)) {
    double previous = INFINITY;
    for (double z : sweep::grid(-500, 9000, 95)) {
      Result<Pressure> p = pressure_from_qnh(metres(z), hectopascals(qnh));
      REQUIRE(p.ok());
      CHECK(p->in(hectopascals) < previous);
      CHECK(p->in(hectopascals) > 250.0);  // ISA at 9000 m with the lowest QNH: ~270 hPa
      CHECK(p->in(hectopascals) < 1170.0);
      previous = p->in(hectopascals);
      for (TemperatureAt where : {TemperatureAt::SeaLevel, TemperatureAt::Station}) {
        double previous_t = z > 0 ? 0.0 : INFINITY;
        for (double t : sweep::grid(-60, 50, 11)) {
          Result<Pressure> hyp = pressure_from_qnh(metres(z), hectopascals(qnh), celsius(t), where);
          REQUIRE(hyp.ok());
          double hpa = hyp->in(hectopascals);
          CHECK(hpa > 150.0);  // 9000 m under a −60 °C sea-level layer: ~170 hPa
          CHECK(hpa < 1250.0);
          // A warmer layer is thicker: above sea level the pressure rises with temperature,
          // below it falls (AMS Glossary, hypsometric equation).
          if (z > 0) CHECK(hpa > previous_t);
          if (z < 0) CHECK(hpa < previous_t);
          previous_t = hpa;
        }
      }
    }
  }
  for (double hpa : sweep::grid(150, 1100, 95)) {
    CHECK(pressure_from_station_reading(hectopascals(hpa))->in(hectopascals) == hpa);
  }
}

TEST_CASE("sweep: just outside every atmosphere range the message names it",
          "[atmosphere][sweep][errors]") {
  CHECK_REFUSED_NAMING(pressure_at(metres(-500.01), Model::Isa), "between -500 and 20000 m");
  CHECK_REFUSED_NAMING(pressure_at(metres(20000.01), Model::Isa), "between -500 and 20000 m");
  CHECK_REFUSED_NAMING(pressure_at(metres(-0.01), Model::West1996), "between 0 and 9000 m");
  CHECK_REFUSED_NAMING(pressure_at(metres(9000.01), Model::West1996), "between 0 and 9000 m");
  CHECK_REFUSED_NAMING(altitude_at(hectopascals(55.2), Model::Isa), "between 55.3 and 1074.7 hPa");
  CHECK_REFUSED_NAMING(altitude_at(hectopascals(1074.8), Model::Isa), "between 55.3 and 1074.7 hPa");
  CHECK_REFUSED_NAMING(altitude_at(hectopascals(329.9), Model::West1996), "between 330 and 1012.6 hPa");
  CHECK_REFUSED_NAMING(altitude_at(hectopascals(1012.7), Model::West1996), "between 330 and 1012.6 hPa");
  CHECK_REFUSED_NAMING(pressure_from_qnh(metres(-500.01), hectopascals(1013)), "between -500 and 9000 m");
  CHECK_REFUSED_NAMING(pressure_from_qnh(metres(9000.01), hectopascals(1013)), "between -500 and 9000 m");
  CHECK_REFUSED_NAMING(pressure_from_qnh(metres(0), hectopascals(899.99)), "between 900 and 1100 hPa");
  CHECK_REFUSED_NAMING(pressure_from_qnh(metres(0), hectopascals(1100.01)), "between 900 and 1100 hPa");
  CHECK_REFUSED_NAMING(pressure_from_qnh(metres(0), hectopascals(1013), celsius(-60.01), TemperatureAt::SeaLevel),
                       "between -60 and 50 °C");
  CHECK_REFUSED_NAMING(pressure_from_qnh(metres(0), hectopascals(1013), celsius(50.01), TemperatureAt::Station),
                       "between -60 and 50 °C");
  CHECK_REFUSED_NAMING(pressure_from_station_reading(hectopascals(149.99)), "between 150 and 1100 hPa");
  CHECK_REFUSED_NAMING(pressure_from_station_reading(hectopascals(1100.01)), "between 150 and 1100 hPa");
}

TEST_CASE("each model publishes its altitude and pressure ranges; the messages are those ranges",
          "[atmosphere][ranges]") {
  // West 1996 0…9000 m and ISA −500…20000 m (the models' stated validity, docs/atmosphere.md).
  units::Range<units::LengthDimension> west = altitude_range(Model::West1996);
  CHECK(west.low_in_unit() == 0.0);
  CHECK(west.high_in_unit() == 9000.0);
  CHECK(altitude_range(Model::Isa).low_in_unit() == -500.0);
  for (Model model : {Model::Isa, Model::West1996}) {
    units::Range<units::LengthDimension> z = altitude_range(model);
    units::Range<units::PressureDimension> p = pressure_range(model);
    // Rounded inward to 0.1 hPa, so every published pressure has an altitude in the model.
    const double exact_low = pressure_at(z.high, model)->in(hectopascals);
    const double exact_high = pressure_at(z.low, model)->in(hectopascals);
    CHECK(p.low_in_unit() >= exact_low);
    CHECK(p.low_in_unit() - exact_low < 0.1);
    CHECK(p.high_in_unit() <= exact_high);
    CHECK(exact_high - p.high_in_unit() < 0.1);
    CHECK(altitude_at(p.low, model).ok());
    CHECK(altitude_at(p.high, model).ok());
    // The exact ends still read back (judged on the exact bounds).
    CHECK(altitude_at(pressure_at(z.high, model).value(), model).ok());
    // A refusal says the published range.
    Result<Length> refused = altitude_at(hectopascals(10), model);  // above both models
    REQUIRE_FALSE(refused.ok());
    CHECK(refused.error().message.rfind(units::range_error("pressure", p).message.substr(0, 30), 0) == 0);
    Result<Pressure> too_high = pressure_at(z.high + metres(1), model);
    REQUIRE_FALSE(too_high.ok());
    CHECK(too_high.error().message.find(std::string(z.note)) != std::string::npos);
  }
  // 330 and 1012.6 hPa: West 1996 at 9000 m and at sea level (West 1996, J Appl Physiol 81:1850).
  CHECK(units::range_error("pressure", pressure_range(Model::West1996)).message ==
        "pressure must be between 330 and 1012.6 hPa for the West 1996 model (0 to 9000 m)");
}
