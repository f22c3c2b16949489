# Installs the build into a fresh prefix and checks that the installed launcher loads the installed
# plugin, not the build tree's. Arguments: BUILD_DIR PREFIX SCRIPT TEST_DIR BINDIR LIBDIR DATADIR.
file(REMOVE_RECURSE "${PREFIX}")
execute_process(COMMAND ${CMAKE_COMMAND} --install "${BUILD_DIR}" --prefix "${PREFIX}"
  RESULT_VARIABLE rc OUTPUT_VARIABLE out ERROR_VARIABLE err)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "cmake --install failed (${rc}):\n${out}\n${err}")
endif()

set(launcher "${PREFIX}/${BINDIR}/ergpath-draw")
foreach(f "${launcher}" "${PREFIX}/${LIBDIR}/libergpath_draw.so" "${PREFIX}/${DATADIR}/ergpath/draw/ErgPath")
  if(NOT EXISTS "${f}")
    message(FATAL_ERROR "not installed: ${f}")
  endif()
endforeach()
file(READ "${launcher}" text)
string(FIND "${text}" "${BUILD_DIR}" at)
if(NOT at EQUAL -1)
  message(FATAL_ERROR "the installed launcher refers to the build tree ${BUILD_DIR}")
endif()

# A clean environment: nothing left over that could point DRAW at the build tree.
execute_process(
  COMMAND ${CMAKE_COMMAND} -E env --unset=LD_LIBRARY_PATH --unset=CSF_ErgPathDefaults
          ERGPATH_TEST_DIR=${TEST_DIR} "${launcher}" -b -f "${SCRIPT}"
  RESULT_VARIABLE rc OUTPUT_VARIABLE out ERROR_VARIABLE err TIMEOUT 60)
message("${out}${err}")
if(NOT out MATCHES "ALL CHECKS PASSED" OR out MATCHES "FAIL|Error|error \\[|error:")
  message(FATAL_ERROR "the installed plugin did not pass its checks")
endif()
string(REGEX MATCH "plugin file: ([^\n]*)" _ "${out}")
set(loaded "${CMAKE_MATCH_1}")
file(REAL_PATH "${PREFIX}" real_prefix)
string(FIND "${loaded}" "${real_prefix}/" at)
if(NOT at EQUAL 0)
  message(FATAL_ERROR "DRAW loaded '${loaded}', not the plugin installed under ${real_prefix}")
endif()
message(STATUS "installed plugin loaded from ${loaded}")
